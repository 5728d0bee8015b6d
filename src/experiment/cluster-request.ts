/** What the job array asks the scheduler for; each setting left out takes the cluster's own default. */
export interface ClusterRequest {
  /** Wall-time limit of each task, in a form sbatch --time accepts (e.g. `2:00:00`). */
  readonly time?: string;
  /** Memory of each task, in a form sbatch --mem accepts (e.g. `4G`; no unit means megabytes). */
  readonly mem?: string;
  readonly partition?: string;
  readonly account?: string;
  /** Array tasks running at once (the `%K` of --array). */
  readonly maxParallel?: number;
}

type TextSetting = 'time' | 'mem' | 'partition' | 'account';

const NAME = '[A-Za-z0-9_.-]+';

/**
 * The forms each text setting may take, from the sbatch manual (SchedMD, sbatch(1)):
 * --time "minutes", "minutes:seconds", "hours:minutes:seconds", "days-hours",
 * "days-hours:minutes", "days-hours:minutes:seconds"; --mem "<size>[units]" with units
 * K, M, G or T, megabytes when none; --partition a comma-separated list of names.
 * Names are kept to letters, digits, '.', '_' and '-' so that a value never needs quoting.
 */
const FORMS: Record<TextSetting, { readonly pattern: RegExp; readonly expected: string }> = {
  time: { pattern: /^(\d+(:\d+){0,2}|\d+-\d+(:\d+){0,2})$/, expected: 'minutes, hours:minutes:seconds or days-hours[:minutes[:seconds]], e.g. 2:00:00' },
  mem: { pattern: /^\d+[KMGTkmgt]?$/, expected: 'a whole number with an optional unit K, M, G or T (megabytes without one), e.g. 4G' },
  partition: { pattern: new RegExp(`^${NAME}(,${NAME})*$`), expected: "partition names of letters, digits, '.', '_' or '-', separated by commas" },
  account: { pattern: new RegExp(`^${NAME}$`), expected: "an account name of letters, digits, '.', '_' or '-'" },
};

/** Why a value of --time, --mem, --partition or --account cannot be sent to the scheduler, or null when it can. */
export function requestProblem(setting: TextSetting, value: string): string | null {
  const form = FORMS[setting];
  return form.pattern.test(value) ? null : `--${setting}: expected ${form.expected}; got '${value}'`;
}

/** The `#SBATCH` lines of the settings that are given (the concurrency cap goes on --array instead). */
export function requestLines(request: ClusterRequest): string[] {
  return (['time', 'mem', 'partition', 'account'] as const)
    .filter((setting) => request[setting] != null)
    .map((setting) => `#SBATCH --${setting}=${request[setting]}`);
}

import type { ExitCode } from './exit-codes.js';

interface OptionBase {
  /** What the option does, for `--help`. */
  readonly description: string;
  /** For a default the command works out when it runs (e.g. from the config): help shows this text. */
  readonly defaultText?: string;
}

/** An option without a value: present or not. */
export interface FlagOption extends OptionBase {
  readonly kind: 'flag';
}

interface ValueOption<V> extends OptionBase {
  /** The value taken when the option is left out; also shown in help. */
  readonly default?: V;
  /** The command cannot run without it. */
  readonly required?: boolean;
}

/** An option whose value is any text (a path, a pose). */
export interface TextOption extends ValueOption<string> {
  readonly kind: 'text';
  /** The value's placeholder in help, e.g. `DIR`. */
  readonly value: string;
}

/** An option whose value is a whole number of at least `min`. */
export interface IntegerOption extends ValueOption<number> {
  readonly kind: 'integer';
  /** The value's placeholder in help, e.g. `N`. */
  readonly value: string;
  readonly min?: number;
}

/** An option whose value is one of a fixed list of names. */
export interface ChoiceOption<C extends string = string> extends ValueOption<C> {
  readonly kind: 'choice';
  readonly choices: readonly C[];
  /** The value's placeholder in help when the list is too long to show as `a|b|c`. */
  readonly value?: string;
}

/** One option of a command, declared once: parsing and help both read it. */
export type OptionDeclaration = FlagOption | TextOption | IntegerOption | ChoiceOption;

/** A positional argument, e.g. `<config>`. */
export interface OperandDeclaration {
  readonly name: string;
  readonly description: string;
  /** May be left out (`[world]`). */
  readonly optional?: boolean;
  /** Takes one or more values (`<file>...`); only the last operand may repeat. */
  readonly repeats?: boolean;
  /** Options any one of which may be given instead of this operand: `(<world> | --config FILE | --replay DIR)`. */
  readonly orOption?: readonly string[];
}

/** What a command does when it runs: takes the words after its name, returns the exit code. */
export type CommandAction = (args: readonly string[]) => Promise<number>;

/** Everything users see of a command, declared once; the command's code is loaded only to run it. */
export interface CommandUsage<Os extends Record<string, OptionDeclaration> = Record<string, OptionDeclaration>> {
  readonly name: string;
  /** One line for the command list, lower case, no full stop. */
  readonly summary: string;
  /** A few more sentences for the command's own help, if the summary is not enough. */
  readonly details?: string;
  readonly operands: readonly OperandDeclaration[];
  /** Options by name without the dashes (`jobs` is `--jobs`). */
  readonly options: Os;
  /** Complete command lines a user can copy. */
  readonly examples: readonly string[];
  /** The exit codes this command can return, in increasing order. */
  readonly exitCodes: readonly ExitCode[];
  /** Loads the command's code. */
  readonly load: () => Promise<CommandAction>;
}

type OptionValue<O> = O extends FlagOption ? boolean
  : O extends IntegerOption ? number
  : O extends ChoiceOption<infer C> ? C
  : string;

type AlwaysSet<O> = O extends FlagOption ? true : O extends { readonly default: unknown } | { readonly required: true } ? true : false;

/** The parsed options of a command: present, defaulted or required options are never undefined. */
export type OptionValues<Os> = {
  readonly [K in keyof Os]: AlwaysSet<Os[K]> extends true ? OptionValue<Os[K]> : OptionValue<Os[K]> | undefined;
};

/** A command line parsed against its usage. */
export interface ParsedArguments<Os> {
  readonly operands: readonly string[];
  readonly values: OptionValues<Os>;
}

/** Declares a command's usage, keeping the literal types of its options for typed values. */
export function defineCommand<const Os extends Record<string, OptionDeclaration>>(usage: CommandUsage<Os>): CommandUsage<Os> {
  return usage;
}

/** A command line that does not fit the command's usage; printed as one line, exit code 1. */
export class UsageError extends Error {
  override name = 'UsageError';
}

import { suggestion } from '../experiment/config-errors.js';
import { operandChoices, operandOrOption, placeholder, synopsis } from './help.js';
import { UsageError, type CommandUsage, type OptionDeclaration, type OptionValues, type ParsedArguments } from './usage.js';

/**
 * Reads a command line against the command's usage: options as `--name value`, `--name=value`
 * or `--name` (flags), anywhere among the operands; `--` ends the options. Throws a
 * UsageError naming the first problem (an unknown option with the nearest valid one, a
 * missing or malformed value, a missing or extra operand).
 */
export function parseArguments<Os extends Record<string, OptionDeclaration>>(usage: CommandUsage<Os>, args: readonly string[]): ParsedArguments<Os> {
  const operands: string[] = [];
  const given = new Map<string, string | null>();
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--') {
      operands.push(...args.slice(i + 1));
      break;
    }
    if (!arg.startsWith('-') || arg === '-') {
      operands.push(arg);
      continue;
    }
    const [flag, inline] = arg.includes('=') ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)] : [arg, null];
    const name = flag.slice(2);
    const option = flag.startsWith('--') && Object.hasOwn(usage.options, name) ? usage.options[name] : undefined;
    if (option == null) throw new UsageError(`unknown option '${flag}'${suggestion(flag, optionFlags(usage))}; see crosswise ${usage.name} --help`);
    if (given.has(name)) throw new UsageError(`${flag} is given twice`);
    if (option.kind === 'flag') {
      if (inline != null) throw new UsageError(`${flag} takes no value, got '${inline}'`);
      given.set(name, null);
    } else if (inline != null) {
      given.set(name, inline);
    } else {
      const next = args[i + 1];
      if (next == null || next.startsWith('--')) throw new UsageError(`${flag} needs a value (${placeholder(option)})`);
      given.set(name, next);
      i++;
    }
  }
  checkOperands(usage, operands, given);
  const values = Object.fromEntries(Object.entries(usage.options).map(([name, option]) => [name, optionValue(name, option, given)]));
  return { operands, values: values as OptionValues<Os> };
}

function optionFlags(usage: CommandUsage): string[] {
  return [...Object.keys(usage.options).map((name) => `--${name}`), '--help'];
}

/** Checks the number of operands; an operand whose stand-in option was given (`orOption`) must be left out. */
function checkOperands(usage: CommandUsage, operands: readonly string[], given: ReadonlyMap<string, string | null>): void {
  const replaced = usage.operands.filter((o) => o.orOption?.some((name) => given.has(name)) === true);
  const declared = usage.operands.filter((o) => !replaced.includes(o));
  const least = declared.filter((operand) => operand.optional !== true).length;
  const most = declared.at(-1)?.repeats === true ? Infinity : declared.length;
  if (replaced.length > 0 && operands.length > most) {
    const words = operandChoices(usage, replaced[0]);
    const choice = words.length === 2 ? `${words.join(' or ')}, not both` : `only one of ${words.join(', ')}`;
    throw new UsageError(`give ${choice} (usage: ${synopsis(usage)})`);
  }
  if (operands.length < least) {
    throw new UsageError(`missing ${operandOrOption(usage, declared[operands.length])} (usage: ${synopsis(usage)})`);
  }
  if (operands.length > most) {
    throw new UsageError(`unexpected argument '${operands[most]}' (usage: ${synopsis(usage)})`);
  }
}

function optionValue(name: string, option: OptionDeclaration, given: ReadonlyMap<string, string | null>): unknown {
  if (option.kind === 'flag') return given.has(name);
  const text = given.get(name);
  if (text == null) {
    if (option.required === true) throw new UsageError(`--${name} ${placeholder(option)} is required (${option.description})`);
    return option.default;
  }
  switch (option.kind) {
    case 'text':
      return text;
    case 'integer': {
      const least = option.min == null ? '' : ` ≥ ${option.min}`;
      const value = Number(text);
      if (!/^-?\d+$/.test(text) || (option.min != null && value < option.min)) {
        throw new UsageError(`--${name}: expected a whole number${least}, got '${text}'`);
      }
      return value;
    }
    case 'choice':
      if (!option.choices.includes(text)) {
        throw new UsageError(`--${name}: expected one of ${option.choices.join(', ')}, got '${text}'${suggestion(text, option.choices)}`);
      }
      return text;
  }
}

import { EXIT_CODES, type ExitCode } from './exit-codes.js';
import type { CommandUsage, OperandDeclaration, OptionDeclaration } from './usage.js';

const WIDTH = 80;
/** Terms longer than this (with their indent) get their text on the next line. */
const MAX_TERM_COLUMN = 30;

/** Whether the words after a command ask for its help (`-h` or `--help` before any `--`). */
export function wantsHelp(args: readonly string[]): boolean {
  const end = args.indexOf('--');
  const options = end === -1 ? args : args.slice(0, end);
  return options.includes('--help') || options.includes('-h');
}

/** The placeholder of an option's value in help and messages: `DIR`, `N`, `wasm|cpu`. */
export function placeholder(option: Exclude<OptionDeclaration, { kind: 'flag' }>): string {
  return option.kind === 'choice' ? option.value ?? option.choices.join('|') : option.value;
}

function optionWords(name: string, option: OptionDeclaration): string {
  return option.kind === 'flag' ? `--${name}` : `--${name} ${placeholder(option)}`;
}

function operandWords(operand: OperandDeclaration): string {
  return `${operand.optional === true ? `[${operand.name}]` : `<${operand.name}>`}${operand.repeats === true ? '...' : ''}`;
}

/** The words of each option that may be given instead of an operand (`--config FILE`). */
function standIns(usage: CommandUsage, operand: OperandDeclaration): string[] {
  return (operand.orOption ?? []).map((name) => optionWords(name, usage.options[name]));
}

/** An operand and the options that may stand in for it: `['<world>', '--config FILE']`. */
export function operandChoices(usage: CommandUsage, operand: OperandDeclaration): string[] {
  return [`<${operand.name}>`, ...standIns(usage, operand)];
}

/** An operand, or the options that may stand in for it, for messages: `<world> or --config FILE`, `<world>, --config FILE or --replay DIR`. */
export function operandOrOption(usage: CommandUsage, operand: OperandDeclaration): string {
  const words = operandChoices(usage, operand);
  return words.length === 1 ? words[0] : `${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}

/** The one-line form of a command: `crosswise sense (<world> | --config FILE) --at X,Y,HEADING [--json]`. */
export function synopsis(usage: CommandUsage): string {
  const alternatives = new Set(usage.operands.flatMap((o) => o.orOption ?? []));
  const operands = usage.operands.map((o) => {
    const options = standIns(usage, o);
    return options.length === 0 ? operandWords(o) : `(${[operandWords(o), ...options].join(' | ')})`;
  });
  const options = Object.entries(usage.options).filter(([name]) => !alternatives.has(name)).map(([name, option]) => {
    const words = optionWords(name, option);
    return option.kind !== 'flag' && option.required === true ? words : `[${words}]`;
  });
  return ['crosswise', usage.name, ...operands, ...options].join(' ');
}

/** `text` broken at spaces into lines of at most `width` characters. */
function wrap(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    if (line !== '' && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else {
      line = line === '' ? word : `${line} ${word}`;
    }
  }
  return [...lines, line];
}

/** Rows of `  term  text`, the texts in one column wrapped to WIDTH; a long term puts its text on the next line. */
function table(rows: readonly (readonly [string, string])[]): string[] {
  const fitting = rows.map(([term]) => term.length).filter((length) => 2 + length + 2 <= MAX_TERM_COLUMN);
  const column = 2 + Math.max(0, ...fitting) + 2;
  const indent = ' '.repeat(column);
  return rows.flatMap(([term, text]) => {
    const lines = wrap(text, WIDTH - column);
    const first = `  ${term}`;
    if (first.length + 2 > column) return [first, ...lines.map((line) => `${indent}${line}`)];
    return lines.map((line, i) => `${i === 0 ? first.padEnd(column) : indent}${line}`);
  });
}

/** What help says after an option's description: required, the choices when not in the placeholder, the default. */
function optionNotes(option: OptionDeclaration): string {
  const notes: string[] = [];
  if (option.kind === 'choice' && option.value != null) notes.push(`one of ${option.choices.join(', ')}`);
  if (option.kind !== 'flag' && option.required === true) notes.push('required');
  else if (option.defaultText != null) notes.push(`default: ${option.defaultText}`);
  else if (option.kind !== 'flag' && option.default != null) notes.push(`default: ${option.default}`);
  return notes.length === 0 ? '' : ` (${notes.join('; ')})`;
}

function exitCodeRows(codes: readonly ExitCode[]): [string, string][] {
  return codes.map((code) => [String(code), EXIT_CODES[code]]);
}

/** The text of `crosswise <command> --help`. */
export function commandHelp(usage: CommandUsage): string {
  const operands = usage.operands.map((o): [string, string] => [operandWords(o), o.description]);
  const options = Object.entries(usage.options).map(([name, option]): [string, string] => [
    optionWords(name, option),
    `${option.description}${optionNotes(option)}`,
  ]);
  return [
    `crosswise ${usage.name}: ${usage.summary}`,
    '',
    `usage: ${synopsis(usage)}`,
    ...(usage.details == null ? [] : ['', ...wrap(usage.details, WIDTH)]),
    ...(operands.length === 0 ? [] : ['', 'arguments:', ...table(operands)]),
    '',
    'options:',
    ...table([...options, ['-h, --help', 'this help']]),
    '',
    usage.examples.length === 1 ? 'example:' : 'examples:',
    ...usage.examples.map((example) => `  ${example}`),
    '',
    'exit codes:',
    ...table(exitCodeRows(usage.exitCodes)),
  ].join('\n');
}

/** The text of `crosswise --help`: every command with its summary, then the exit codes. */
export function programHelp(commands: readonly CommandUsage[], version: string): string {
  return [
    `crosswise ${version}: a gridworld lab for cross-modal self-supervised learning`,
    '',
    'usage: crosswise <command> [arguments] [options]',
    '',
    'commands:',
    ...table(commands.map((c) => [c.name, c.summary])),
    '',
    ...table([
      ['crosswise <command> --help', "a command's arguments, options, an example and its exit codes"],
      ['crosswise --version', 'the version'],
    ]),
    '',
    'exit codes:',
    ...table(exitCodeRows(Object.keys(EXIT_CODES).map(Number) as ExitCode[])),
  ].join('\n');
}

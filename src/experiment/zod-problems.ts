import { z } from 'zod';
import { suggestion, type ConfigProblem } from './config-errors.js';

type Issue = z.core.$ZodIssue & { readonly input?: unknown };

/** Plain-English problems for the issues of a failed zod parse (parsed with `reportInput: true`). */
export function problemsFromIssues(schema: z.ZodType, issues: readonly Issue[]): ConfigProblem[] {
  return issues.flatMap((issue) => {
    const path = issue.path.map((segment) => (typeof segment === 'symbol' ? String(segment) : segment));
    if (issue.code === 'unrecognized_keys') {
      const allowed = keysAt(schema, path, issue.input);
      return issue.keys.map((key) => ({
        path: [...path, key],
        atKey: true,
        message: `unknown key${suggestion(key, allowed)}; expected one of ${allowed.join(', ')}`,
      }));
    }
    return [{ path, message: describeIssue(issue) }];
  });
}

function describeIssue(issue: Issue): string {
  const got = issue.input === undefined ? 'nothing' : shown(issue.input);
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined ? `required, expected ${issue.expected}` : `expected ${issue.expected}, got ${got}`;
    case 'invalid_value': {
      const options = issue.values.map(String);
      const near = typeof issue.input === 'string' ? suggestion(issue.input, options) : '';
      return `expected one of ${options.join(' | ')}, got ${got}${near}`;
    }
    case 'too_small':
      return issue.origin === 'array'
        ? `expected at least ${issue.minimum} item${Number(issue.minimum) === 1 ? '' : 's'}, got ${got}`
        : `expected a value ${issue.inclusive === false ? '>' : '≥'} ${issue.minimum}, got ${got}`;
    case 'too_big':
      return issue.origin === 'array'
        ? `expected at most ${issue.maximum} items`
        : `expected a value ${issue.inclusive === false ? '<' : '≤'} ${issue.maximum}, got ${got}`;
    case 'invalid_format':
      return `expected ${issue.message}, got ${got}`;
    case 'invalid_union':
      return discriminatorProblem(issue) ?? `expected ${unionExpectation(issue)}, got ${got}`;
    default:
      return `${issue.message}, got ${got}`;
  }
}

/** An unknown value of a discriminated union's key (`encoder.kind`), reported at that key. */
function discriminatorProblem(issue: z.core.$ZodIssueInvalidUnion & { readonly input?: unknown }): string | null {
  const { discriminator, options } = issue as { discriminator?: string; options?: unknown[] };
  if (discriminator == null || options == null) return null;
  const values = options.filter((o) => o != null).map(String);
  const value = (issue.input as Record<string, unknown> | undefined)?.[discriminator];
  const near = typeof value === 'string' ? suggestion(value, values) : '';
  return `expected one of ${values.join(' | ')}, got ${value === undefined ? 'nothing' : shown(value)}${near}`;
}

function unionExpectation(issue: z.core.$ZodIssueInvalidUnion): string {
  const values = issue.errors.flat().flatMap((inner) => (inner.code === 'invalid_value' ? inner.values.map(String) : []));
  return values.length > 0 ? `one of ${values.join(' | ')}` : 'a valid value';
}

function shown(value: unknown): string {
  if (typeof value === 'string') return `'${value}'`;
  if (Array.isArray(value)) return value.length === 0 ? 'an empty list' : `a list`;
  if (value === null) return 'null';
  if (typeof value === 'object') return 'a mapping';
  return String(value);
}

/**
 * Keys the schema allows at an object path (through defaults, optionals and arrays); at a
 * discriminated union, those of the option the object's discriminator picks (else the first).
 */
function keysAt(schema: z.ZodType, path: readonly (string | number)[], input: unknown): string[] {
  let node: z.ZodType | undefined = schema;
  for (const segment of path) {
    node = node == null ? undefined : unwrap(node);
    if (node instanceof z.ZodObject) node = node.shape[String(segment)] as z.ZodType | undefined;
    else if (node instanceof z.ZodArray) node = node.element as z.ZodType;
    else if (node instanceof z.ZodRecord) node = node.valueType as z.ZodType;
    else node = undefined;
  }
  node = node == null ? undefined : unwrap(node);
  if (node instanceof z.ZodDiscriminatedUnion) node = optionFor(node, input);
  return node instanceof z.ZodObject ? Object.keys(node.shape) : [];
}

function optionFor(union: z.ZodDiscriminatedUnion, input: unknown): z.ZodType {
  const key = union._zod.def.discriminator;
  const value = input != null && typeof input === 'object' ? (input as Record<string, unknown>)[key] : undefined;
  const options = union.options as z.ZodType[];
  return options.find((o) => o instanceof z.ZodObject && (unwrap(o.shape[key] as z.ZodType) as z.ZodLiteral).values.has(value as never)) ?? options[0];
}

function unwrap(schema: z.ZodType): z.ZodType {
  let node = schema;
  for (;;) {
    const inner = (node._zod.def as { innerType?: z.ZodType }).innerType;
    if (inner == null) return node;
    node = inner;
  }
}

/**
 * Every dotted path into a schema's objects, lists of objects written `*`
 * (`learners.*.encoder.hidden`), inner objects included (`collect.split`).
 */
export function schemaPaths(schema: z.ZodType): string[] {
  const walk = (node: z.ZodType, prefix: string): string[] => {
    const inner = unwrap(node);
    if (inner instanceof z.ZodObject) {
      return Object.entries(inner.shape as Record<string, z.ZodType>)
        .flatMap(([key, value]) => [`${prefix}${key}`, ...walk(value, `${prefix}${key}.`)]);
    }
    if (inner instanceof z.ZodArray && unwrap(inner.element as z.ZodType) instanceof z.ZodObject) return walk(inner.element as z.ZodType, `${prefix}*.`);
    // A union (the encoder kinds) offers the paths of every option.
    if (inner instanceof z.ZodUnion) return (inner.options as readonly z.ZodType[]).flatMap((option) => walk(option, prefix));
    return [];
  };
  return [...new Set(walk(schema, ''))];
}

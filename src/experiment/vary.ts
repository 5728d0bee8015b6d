/** Top-level sections a `vary` path may start with (seeds are already a sweep dimension). */
export const VARIABLE_SECTIONS = ['world', 'collect', 'senses', 'learners', 'probe', 'noise'] as const;

type Path = readonly (string | number)[];

/**
 * Concrete locations a vary key names in a config (file spelling).
 *
 * Segments are object keys; over a list, `*` means every item that has the rest of
 * the path, a number means that item, and any other word means the item whose `name`
 * it is (so `learners.sound-from-sight.rule` works).
 */
export function matchVaryPath(config: unknown, key: string): Path[] {
  const segments = key.split('.');
  if (!(VARIABLE_SECTIONS as readonly string[]).includes(segments[0])) return [];
  return walk(config, segments, []);
}

function walk(node: unknown, segments: readonly string[], at: Path): Path[] {
  if (segments.length === 0) return [at];
  const [segment, ...rest] = segments;
  if (Array.isArray(node)) {
    const indices = node.map((_, i) => i).filter((i) => segment === '*' || segment === String(i) || nameOf(node[i]) === segment);
    return indices.flatMap((i) => walk(node[i], rest, [...at, i]));
  }
  if (node != null && typeof node === 'object' && Object.hasOwn(node, segment)) {
    return walk((node as Record<string, unknown>)[segment], rest, [...at, segment]);
  }
  return [];
}

function nameOf(item: unknown): unknown {
  return item != null && typeof item === 'object' ? (item as { name?: unknown }).name : undefined;
}

/** A copy of `config` with `value` written at every location. */
export function withValues<T>(config: T, assignments: readonly { readonly paths: readonly Path[]; readonly value: unknown }[]): T {
  const copy = structuredClone(config);
  for (const { paths, value } of assignments) {
    for (const path of paths) {
      let node = copy as Record<string | number, unknown>;
      for (const segment of path.slice(0, -1)) node = node[segment] as Record<string | number, unknown>;
      node[path[path.length - 1]] = structuredClone(value);
    }
  }
  return copy;
}

/** Every combination of the lists, the first key varying slowest. */
export function cartesian(lists: readonly (readonly unknown[])[]): unknown[][] {
  return lists.reduce<unknown[][]>(
    (combos, values) => combos.flatMap((combo) => values.map((value) => [...combo, value])),
    [[]],
  );
}

/** A vary value as it appears in plans and results: strings as written, anything else as compact JSON. */
export function varyText(value: unknown): string {
  return typeof value === 'string' ? value : JSON.stringify(value);
}

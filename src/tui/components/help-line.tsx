import { Text } from 'ink';

/** The keys of the current screen as `key action` pairs on one line. */
export function HelpLine({ keys }: { readonly keys: readonly (readonly [string, string])[] }) {
  return <Text dimColor>{keys.map(([key, action]) => `${key} ${action}`).join('  ')}</Text>;
}

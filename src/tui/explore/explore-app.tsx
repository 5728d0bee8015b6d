import { useApp, useInput, type Key } from 'ink';
import { useEffect, useMemo, useReducer } from 'react';
import { ExploreScreen } from '../components/explore-screen.js';
import { useTerminalSize } from '../use-terminal-size.js';
import { reduceExplore, type ExploreKey, type ExploreState } from './explore-state.js';
import { exploreView } from './explore-view.js';

const CONTROL_CHARACTERS: Readonly<Record<string, ExploreKey>> = { '\r': 'enter', '\n': 'enter', '\x7f': 'backspace', '\b': 'backspace' };

/**
 * Ink's key report as the reducer's key names. Keys typed faster than the terminal is read
 * (or pasted) arrive as one string, which stands for one key per character.
 */
export function keyNames(input: string, key: Key): ExploreKey[] {
  if (key.upArrow) return ['up'];
  if (key.downArrow) return ['down'];
  if (key.leftArrow) return ['left'];
  if (key.rightArrow) return ['right'];
  if (key.home) return ['home'];
  if (key.end) return ['end'];
  if (key.escape) return ['escape'];
  if (key.return) return ['enter'];
  if (key.backspace || key.delete) return ['backspace'];
  return [...input].map((c) => CONTROL_CHARACTERS[c] ?? c);
}

/** The explore root: owns the state, the keys and the terminal size; everything below only displays. */
export function ExploreApp({ initial }: { readonly initial: ExploreState }) {
  const [state, dispatch] = useReducer(reduceExplore, initial);
  const { exit } = useApp();
  const size = useTerminalSize();
  useInput((input, key) => { for (const name of keyNames(input, key)) dispatch(name); });
  useEffect(() => {
    if (state.quit) exit();
  }, [state.quit, exit]);
  const view = useMemo(() => exploreView(state, size), [state, size]);
  return <ExploreScreen view={view} />;
}

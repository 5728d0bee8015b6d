import { useApp, useInput } from 'ink';
import { useCallback, useEffect, useMemo, useReducer } from 'react';
import { ExploreScreen } from '../components/explore-screen.js';
import { useTerminalSize } from '../use-terminal-size.js';
import { keyNames } from './explore-app.js';
import { reduceReplay, stepsPerSecond, type ReplayState } from './replay-state.js';
import { replayView } from './replay-view.js';
import { usePlayer } from './use-player.js';

/** The replay root: owns the state, the keys, the player's beat and the terminal size; everything below only displays. */
export function ReplayApp({ initial }: { readonly initial: ReplayState }) {
  const [state, dispatch] = useReducer(reduceReplay, initial);
  const { exit } = useApp();
  const size = useTerminalSize();
  useInput((input, key) => { for (const name of keyNames(input, key)) dispatch(name); });
  const beat = useCallback(() => dispatch('tick'), []);
  usePlayer(state.playing, stepsPerSecond(state), beat);
  useEffect(() => {
    if (state.explore.quit) exit();
  }, [state.explore.quit, exit]);
  const view = useMemo(() => replayView(state, size), [state, size]);
  return <ExploreScreen view={view} />;
}

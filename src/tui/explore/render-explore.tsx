import { render } from 'ink';
import { ExploreApp } from './explore-app.js';
import { initialExploreState, type ExploreWorld } from './explore-state.js';

/** Mounts the explore screen on the terminal; resolves `waitUntilExit` when the user quits. */
export function renderExplore(options: { readonly worlds: readonly ExploreWorld[]; readonly seed: number; readonly colour: boolean }): {
  waitUntilExit(): Promise<void>;
} {
  const instance = render(<ExploreApp initial={initialExploreState(options.worlds, options.seed, options.colour)} />);
  return { waitUntilExit: async () => { await instance.waitUntilExit(); } };
}

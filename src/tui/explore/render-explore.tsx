import { render } from 'ink';
import { ExploreApp } from './explore-app.js';
import type { World } from '../../world/types.js';
import { initialExploreState } from './explore-state.js';

/** Mounts the explore screen on the terminal; resolves `waitUntilExit` when the user quits. */
export function renderExplore(options: { readonly worlds: readonly World[]; readonly seed: number; readonly colour: boolean }): {
  waitUntilExit(): Promise<void>;
} {
  const instance = render(<ExploreApp initial={initialExploreState(options.worlds, options.seed, options.colour)} />);
  return { waitUntilExit: async () => { await instance.waitUntilExit(); } };
}

import { render } from 'ink';
import type { SenseSettings } from '../../senses/channel.js';
import type { World } from '../../world/types.js';
import { ExploreApp } from './explore-app.js';
import { initialExploreState } from './explore-state.js';

// The screen fills the terminal, and Ink clears the whole terminal (scrollback included)
// before each frame that tall; the alternate screen keeps the user's shell history intact
// and gives it back on exit.
const ENTER_ALTERNATE_SCREEN = '\u001B[?1049h';
const LEAVE_ALTERNATE_SCREEN = '\u001B[?1049l';

/** Mounts the explore screen on the terminal; resolves `waitUntilExit` when the user quits. */
export function renderExplore(options: {
  readonly worlds: readonly World[];
  readonly seed: number;
  readonly colour: boolean;
  readonly settings: SenseSettings;
}): { waitUntilExit(): Promise<void> } {
  const { stdout } = process;
  if (stdout.isTTY) stdout.write(ENTER_ALTERNATE_SCREEN);
  const instance = render(<ExploreApp initial={initialExploreState(options.worlds, options.seed, options.colour, options.settings)} />);
  return {
    waitUntilExit: async () => {
      try {
        await instance.waitUntilExit();
      } finally {
        if (stdout.isTTY) stdout.write(LEAVE_ALTERNATE_SCREEN);
      }
    },
  };
}

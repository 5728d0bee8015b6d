import { render } from 'ink';
import type { ReactElement } from 'react';
import type { Recording } from '../../results/recording.js';
import type { SenseSettings } from '../../senses/channel.js';
import type { World } from '../../world/types.js';
import { ExploreApp } from './explore-app.js';
import { initialExploreState } from './explore-state.js';
import { ReplayApp } from './replay-app.js';
import { initialReplayState } from './replay-state.js';

// The screen fills the terminal, and Ink clears the whole terminal (scrollback included)
// before each frame that tall; the alternate screen keeps the user's shell history intact
// and gives it back on exit.
const ENTER_ALTERNATE_SCREEN = '\u001B[?1049h';
const LEAVE_ALTERNATE_SCREEN = '\u001B[?1049l';

/** Mounts a full-screen app on the alternate screen; resolves `waitUntilExit` when the user quits. */
function mountFullScreen(app: ReactElement): { waitUntilExit(): Promise<void> } {
  const { stdout } = process;
  if (stdout.isTTY) stdout.write(ENTER_ALTERNATE_SCREEN);
  const instance = render(app);
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

/** Mounts the explore screen on the terminal; resolves `waitUntilExit` when the user quits. */
export function renderExplore(options: {
  readonly worlds: readonly World[];
  readonly seed: number;
  readonly colour: boolean;
  readonly settings: SenseSettings;
}): { waitUntilExit(): Promise<void> } {
  return mountFullScreen(<ExploreApp initial={initialExploreState(options.worlds, options.seed, options.colour, options.settings)} />);
}

/** Mounts the replay of a recording made in `world`; resolves `waitUntilExit` when the user quits. */
export function renderReplay(options: {
  readonly recording: Recording;
  readonly world: World;
  readonly seed: number;
  readonly colour: boolean;
}): { waitUntilExit(): Promise<void> } {
  return mountFullScreen(<ReplayApp initial={initialReplayState(options.recording, options.world, options.seed, options.colour)} />);
}

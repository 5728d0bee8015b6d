import { Box, Text, useApp, useInput } from 'ink';
import { useEffect, useRef, useState } from 'react';
import { HelpLine } from '../components/help-line.js';
import { ProgressHeader } from '../components/progress-header.js';
import { ResultsTable } from '../components/results-table.js';
import { WorkerList } from '../components/worker-list.js';
import { progressText, tableText, workerTexts, type Summarise } from './run-view.js';
import { useNow, useRunState, type Subscribe } from './use-run-state.js';

/** What the dashboard needs from the runner. */
export interface DashboardProps {
  readonly subscribe: Subscribe;
  readonly onStop: () => void;
  readonly total: number;
  readonly name: string;
  readonly summarise: Summarise;
  /** Milliseconds since the epoch; tests pass a fake clock. */
  readonly now: () => number;
}

const KEYS: readonly (readonly [string, string])[] = [['t', 'next target'], ['n', 'next noise'], ['q', 'stop (running cells finish)']];

/** The live view of a sweep; handles the keys and exits once the sweep is done. */
export function Dashboard(props: DashboardProps) {
  const state = useRunState(props.subscribe, props.name, props.total, props.now);
  const nowMs = useNow(props.now, 1000, state.finished == null);
  const [viewIndex, setViewIndex] = useState(0);
  const [noiseIndex, setNoiseIndex] = useState(0);
  const [stopping, setStopping] = useState(false);
  const stopSent = useRef(false); // keys can arrive faster than re-renders
  const { exit } = useApp();

  useInput((input, key) => {
    if (input === 't') setViewIndex((i) => i + 1);
    else if (input === 'n') setNoiseIndex((i) => i + 1);
    else if ((input === 'q' || (key.ctrl && input === 'c')) && !stopSent.current) {
      stopSent.current = true;
      setStopping(true);
      props.onStop();
    }
  });
  useEffect(() => {
    if (state.finished != null) exit();
  }, [state.finished, exit]);

  const view = state.views.length === 0 ? '' : state.views[viewIndex % state.views.length];
  const noise = state.noises.length === 0 ? '' : state.noises[noiseIndex % state.noises.length];
  return (
    <Box flexDirection="column">
      <ProgressHeader progress={progressText(state, nowMs, stopping)} />
      <Text> </Text>
      <WorkerList workers={workerTexts(state)} />
      <Text> </Text>
      <ResultsTable table={tableText(state, view, noise, props.summarise)} />
      {state.finished == null ? <Box marginTop={1}><HelpLine keys={KEYS} /></Box> : null}
    </Box>
  );
}

import { useMemo } from 'react';
import type { ClientEvent } from '../events';
import { createRunTracker } from '../run-tracker';
import type { RunnerPlan, RunnerState } from '../state';

/**
 * The wheel's progress for the screen: exactly `reduceRun(plan, events)`, but a tap (an event
 * later than all the others) is added to what was already reduced instead of reducing the whole
 * log again, and a log with nothing new gives the same state object back.
 */
export function useRunState(plan: RunnerPlan, events: readonly ClientEvent[]): RunnerState {
  const track = useMemo(() => createRunTracker(plan), [plan]);
  return useMemo(() => track(events), [track, events]);
}

import type { ClientEvent } from './events';
import {
  orderEvents,
  startRun,
  type RunAccumulator,
  type RunnerPlan,
  type RunnerState,
} from './state';

/** `orderEvents`'s comparison: whether `a` sorts after `b`. */
const laterThan = (a: ClientEvent, b: ClientEvent) =>
  (a.clientAt.localeCompare(b.clientAt) || a.clientId.localeCompare(b.clientId)) > 0;

/** The same event, as far as the reducer can tell (a copy from the server may be another object). */
const sameEvent = (a: ClientEvent, b: ClientEvent) =>
  a === b ||
  (a.clientAt === b.clientAt &&
    a.type === b.type &&
    JSON.stringify(a.payload) === JSON.stringify(b.payload));

/**
 * `reduceRun` for a log that grows at its end, as the runner's does with every tap. Each call
 * takes the whole log and gives exactly `reduceRun(plan, events)`: when every new event comes
 * after everything applied so far (in `orderEvents` order) they are added to the running totals,
 * and only then; an event that sorts earlier (another phone's, pulled late), a changed one (the
 * server moved its clock time) or a missing one (refused, superseded) reduces the whole log
 * again. With nothing new it hands back the same state object.
 */
export function createRunTracker(
  plan: RunnerPlan,
): (events: readonly ClientEvent[]) => RunnerState {
  let run: RunAccumulator = startRun(plan);
  let applied = new Map<string, ClientEvent>();
  let last: ClientEvent | null = null;
  let state = run.state();

  const rebuild = (events: readonly ClientEvent[]) => {
    run = startRun(plan);
    applied = new Map();
    last = null;
    add(orderEvents(events));
  };
  const add = (ordered: readonly ClientEvent[]) => {
    for (const e of ordered) {
      if (applied.has(e.clientId)) continue; // a duplicate: the first in order counted
      run.apply(e);
      applied.set(e.clientId, e);
      last = e;
    }
    state = run.state();
  };

  return (events) => {
    const fresh: ClientEvent[] = [];
    const stillThere = new Set<string>();
    let changed = false;
    for (const e of events) {
      const had = applied.get(e.clientId);
      if (!had) fresh.push(e);
      else if (sameEvent(had, e)) stillThere.add(e.clientId);
      else changed = true;
    }
    if (changed || stillThere.size !== applied.size) {
      rebuild(events);
      return state;
    }
    if (!fresh.length) return state;
    const ordered = orderEvents(fresh);
    if (last && !laterThan(ordered[0]!, last)) rebuild(events);
    else add(ordered);
    return state;
  };
}

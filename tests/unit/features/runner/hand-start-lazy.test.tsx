// @vitest-environment jsdom
// The hand-start panel is a lazy part: a wheel already past hand-start never fetches its file; a
// wheel before it fetches it after the first paint, so the step opens at once when reached.
import 'fake-indexeddb/auto';
import { render, screen, waitFor } from '@testing-library/react';
import { clear } from 'idb-keyval';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SaveEvents } from '@/features/runner/api/use-run-queue';
import { Runner, type RunnerProps } from '@/features/runner/components/runner';
import type { ClientEvent, RunEvent } from '@/features/runner/events';
import type { RunnerPlan } from '@/features/runner/state';
import { stepsFor } from '@/features/runner/steps';
import { CLICK_WRENCH } from '@/tests/helpers/runner-fixtures';

const loads = vi.hoisted(() => ({ handStart: 0 }));
vi.mock('@/features/runner/components/hand-start-panel', async (importOriginal) => {
  loads.handStart++;
  return importOriginal();
});

const plan: RunnerPlan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: 8,
  passes: [{ index: 1, kind: 'staged', order: [1, 5, 3, 7, 2, 6, 4, 8] }],
};

/** The server's events: every step up to `until` done (hand-start bolt by bolt). */
function doneUpTo(until: string): ClientEvent[] {
  const out: RunEvent[] = [];
  for (const step of plan.steps) {
    if (step.id === until) break;
    if (step.id === 'hand_start')
      for (let bolt = 1; bolt <= plan.boltCount; bolt++)
        out.push({ type: 'hand_started', payload: { bolt } });
    out.push({ type: 'step_done', payload: { step: step.id, checklist: [] } });
  }
  return out.map(
    (e, i) =>
      ({
        ...e,
        clientId: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
        clientAt: new Date(Date.UTC(2026, 0, 1, 7, 0, i)).toISOString(),
      }) as ClientEvent,
  );
}

const save: SaveEvents = async (_prev, { events }) => ({
  ok: true,
  data: { saved: events.length, duplicates: 0 },
});
const props = (events: ClientEvent[]): RunnerProps => ({
  jobId: '2a7d1f0c-9b11-4c55-9f3e-6d3a0f7e1c1b',
  jobNumber: 41,
  wheel: {
    id: '5e2b8c1a-7d4f-4a3e-9b6c-0f1e2d3c4b5a',
    position: 'LF',
    tireSize: '30x10R14',
    directional: false,
    targetPressure: 12,
    pressureUnit: 'psi',
  },
  spec: { name: 'Dune 16', maxBeadSeatPressure: 35, pressureUnit: 'psi', lugTorque: null },
  plan,
  targets: [{ value: 50, unit: 'lbf-ft' }],
  wrenches: [CLICK_WRENCH],
  verifications: [],
  rules: {
    minFractionOfMax: 0.2,
    verification: { recency: 'same_day', days: 1, nearPercent: 0 },
    timeZone: 'UTC',
  },
  events,
  photos: [],
  saveEvents: save,
  signInHref: '/sign-in',
  person: { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' },
  mayRecordVerifications: true,
});

describe('the hand-start panel, loaded on demand', () => {
  beforeEach(async () => {
    await clear();
    vi.stubGlobal(
      'fetch',
      vi.fn(() => new Promise(() => {})),
    );
  });
  afterEach(() => vi.unstubAllGlobals());

  // In this order: the module loads once per file.
  it('is never fetched for a wheel already past hand-start', async () => {
    const view = render(<Runner {...props(doneUpTo('torque'))} />);
    await screen.findByText('Saved');
    await new Promise((r) => setTimeout(r, 250)); // past the after-paint preload's latest moment
    expect(loads.handStart).toBe(0);
    view.unmount();
  });

  it('is fetched after the first paint for a wheel before hand-start, and shows when its step opens', async () => {
    const before = render(<Runner {...props(doneUpTo('index'))} />);
    await screen.findByText('Saved');
    await waitFor(() => expect(loads.handStart).toBe(1));
    before.unmount();
    render(<Runner {...props(doneUpTo('hand_start'))} />);
    // Already fetched: the panel, not its "Loading the hand-start ring…" placeholder.
    expect(await screen.findByRole('heading', { level: 1 })).toHaveTextContent(
      'Start every bolt by hand',
    );
    await waitFor(() => expect(screen.queryByText(/Loading the hand-start ring/)).toBeNull());
    expect(loads.handStart).toBe(1);
  });
});

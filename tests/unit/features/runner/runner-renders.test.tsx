// @vitest-environment jsdom
// The device's IndexedDB in memory (fake-indexeddb), under the real idb-keyval the runner uses.
import 'fake-indexeddb/auto';
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { clear } from 'idb-keyval';
import { createElement, Fragment, memo, useLayoutEffect, type ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SaveEvents } from '@/features/runner/api/use-run-queue';
import { Runner, type RunnerProps } from '@/features/runner/components/runner';
import { DOUBLE_TAP_MS } from '@/features/runner/double-tap';
import type { ClientEvent, RunEvent } from '@/features/runner/events';
import { reduceRun, type RunnerPlan } from '@/features/runner/state';
import { useRunnerSettings } from '@/features/runner/settings-store';
import { stepsFor } from '@/features/runner/steps';
import { CLICK_WRENCH } from '@/tests/helpers/runner-fixtures';

// Render counters. Each counted part is the real component under the same memo (React's default
// prop comparison), so it redraws exactly when the real one would; a part that is not memoised
// has no inner `type` and fails the test.
// The header's status line as each of its renders committed it (`statuses`).
const renders = vi.hoisted(() => ({
  counts: new Map<string, number>(),
  bolts: [] as number[],
  statuses: [] as (string | null)[],
}));
function counted(name: string, real: unknown) {
  const inner = (real as { type: (p: object) => ReactNode }).type;
  return memo(function Counted(props: object) {
    renders.counts.set(name, (renders.counts.get(name) ?? 0) + 1);
    if (name === 'Bolt') renders.bolts.push((props as { bolt: number }).bolt);
    if (name === 'RunnerHeader')
      return createElement(Fragment, null, inner(props), createElement(StatusProbe));
    return inner(props);
  });
}
/** Reads the header's status after each commit of a header render (drawn with it, no memo). */
function StatusProbe() {
  useLayoutEffect(() => {
    renders.statuses.push(document.querySelector('header [role="status"]')?.textContent ?? null);
  });
  return null;
}
// The header's way back (next/link), counted around the real link.
vi.mock('next/link', async (real: () => Promise<{ default: (p: object) => ReactNode }>) => {
  const [mod, { createElement }] = await Promise.all([real(), import('react')]);
  return {
    ...mod,
    default: function CountedLink(props: object) {
      renders.counts.set('Link', (renders.counts.get('Link') ?? 0) + 1);
      return createElement(mod.default, props);
    },
  };
});
vi.mock('@/features/bolt-circle/bolt', async (real: () => Promise<Record<string, unknown>>) => {
  const mod = await real();
  return { ...mod, Bolt: counted('Bolt', mod.Bolt) };
});
vi.mock(
  '@/features/runner/components/torque-panel',
  async (real: () => Promise<Record<string, unknown>>) => {
    const mod = await real();
    return { ...mod, TorquePanel: counted('TorquePanel', mod.TorquePanel) };
  },
);
vi.mock(
  '@/features/runner/components/pass-ring',
  async (real: () => Promise<Record<string, unknown>>) => {
    const mod = await real();
    return { ...mod, PassRing: counted('PassRing', mod.PassRing) };
  },
);
vi.mock(
  '@/features/runner/components/runner-header',
  async (real: () => Promise<Record<string, unknown>>) => {
    const mod = await real();
    return { ...mod, RunnerHeader: counted('RunnerHeader', mod.RunnerHeader) };
  },
);
vi.mock(
  '@/features/runner/components/runner-footer',
  async (real: () => Promise<Record<string, unknown>>) => {
    const mod = await real();
    return { ...mod, RunnerFooter: counted('RunnerFooter', mod.RunnerFooter) };
  },
);

const WHEEL = '6d3a0f7e-1c1b-4c55-9f3e-2a7d1f0c9b11';
const plan: RunnerPlan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: 8,
  passes: [
    { index: 1, kind: 'staged', order: [1, 5, 3, 7, 2, 6, 4, 8] },
    { index: 2, kind: 'check', order: [1, 2, 3, 4, 5, 6, 7, 8] },
  ],
};

/** What the server holds: every step before the torque passes done, TW-1 chosen for pass 1. */
function upToTorque(): ClientEvent[] {
  const out: RunEvent[] = [];
  for (const step of plan.steps) {
    if (step.id === 'torque') break;
    if (step.id === 'hand_start')
      for (let bolt = 1; bolt <= plan.boltCount; bolt++)
        out.push({ type: 'hand_started', payload: { bolt } });
    out.push({ type: 'step_done', payload: { step: step.id, checklist: [] } });
  }
  out.push({ type: 'wrench_chosen', payload: { pass: 1, wrenchId: CLICK_WRENCH.id } });
  return out.map(
    (e, i) =>
      ({
        ...e,
        clientId: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
        clientAt: new Date(Date.UTC(2026, 0, 1, 7, 0, i)).toISOString(),
      }) as ClientEvent,
  );
}

function props(saveEvents: SaveEvents): RunnerProps {
  return {
    jobId: '2a7d1f0c-9b11-4c55-9f3e-6d3a0f7e1c1b',
    jobNumber: 41,
    wheel: {
      id: WHEEL,
      position: 'LF',
      tireSize: '30x10R14',
      directional: false,
      targetPressure: 12,
      pressureUnit: 'psi',
    },
    spec: { name: 'Dune 16', maxBeadSeatPressure: 35, pressureUnit: 'psi', lugTorque: null },
    plan,
    targets: [
      { value: 50, unit: 'lbf-ft' },
      { value: 50, unit: 'lbf-ft' },
    ],
    wrenches: [CLICK_WRENCH],
    // Verified today at a point the shop's rule accepts: the pass opens without a verification.
    verifications: [
      {
        wrenchId: CLICK_WRENCH.id,
        recordedAt: new Date().toISOString(),
        referenceValue: 50,
        unit: 'lbf-ft',
      },
    ],
    rules: {
      minFractionOfMax: 0.2,
      verification: { recency: 'same_day', days: 1, nearPercent: 0 },
      timeZone: 'UTC',
    },
    events: upToTorque(),
    photos: [],
    saveEvents,
    signInHref: '/sign-in',
    person: { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' },
    mayRecordVerifications: true,
  };
}

const reset = () => {
  renders.counts.clear();
  renders.bolts = [];
  renders.statuses = [];
};
const count = (name: string) => renders.counts.get(name) ?? 0;

describe('a tap on the runner', () => {
  beforeEach(async () => {
    await clear();
    // Other phones' events are polled from the server: nothing comes in this test.
    vi.stubGlobal(
      'fetch',
      vi.fn(() => new Promise(() => {})),
    );
  });
  afterEach(() => vi.unstubAllGlobals());

  it('redraws the pass, the two bolts that changed and the count; the save answer redraws only the header', async () => {
    expect(reduceRun(plan, upToTorque()).current).toBe('torque');
    let answer: (ok: true) => void = () => {};
    const save = vi.fn<SaveEvents>(
      (_prev, { events }) =>
        new Promise((resolve) => {
          answer = () => resolve({ ok: true, data: { saved: events.length, duplicates: 0 } });
        }),
    );
    render(<Runner {...props(save)} />);
    await screen.findByText('Saved');
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    const clicked = await screen.findByRole('button', { name: 'Clicked — bolt 1' });

    reset();
    fireEvent.click(clicked);
    await screen.findByRole('button', { name: 'Clicked — bolt 5' });
    await waitFor(() => expect(save).toHaveBeenCalledTimes(1));
    expect(screen.getByText('1 waiting')).toBeInTheDocument();
    // The panel and its ring draw the new progress once; of the eight bolts only bolt 1 (now
    // done) and bolt 5 (now next); the footer not at all.
    expect(count('TorquePanel')).toBe(1);
    expect(count('PassRing')).toBe(1);
    expect(renders.bolts.sort()).toEqual([1, 5]);
    // The header twice: in the tap's render, which already leaves "Saved" (a tap waits), then
    // alone for the deferred count (useDeferredValue); its way back (a link) not at all.
    expect(count('RunnerHeader')).toBe(2);
    expect(renders.statuses).toEqual(['1 waiting', '1 waiting']);
    expect(count('Link')).toBe(0);
    expect(count('RunnerFooter')).toBe(0);

    reset();
    await act(async () => answer(true));
    await screen.findByText('Saved');
    expect(count('RunnerHeader')).toBeGreaterThanOrEqual(1);
    expect(count('Link')).toBe(0);
    expect(count('TorquePanel')).toBe(0);
    expect(count('PassRing')).toBe(0);
    expect(count('Bolt')).toBe(0);
    expect(count('RunnerFooter')).toBe(0);
  });

  it("a change of the phone's settings redraws the footer, not the pass; the buzz follows the setting at the tap", async () => {
    const vibrate = vi.fn(() => true);
    Object.defineProperty(navigator, 'vibrate', { value: vibrate, configurable: true });
    const save = vi.fn<SaveEvents>(() => new Promise(() => {}));
    render(<Runner {...props(save)} />);
    await screen.findByText('Saved');
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Clicked — bolt 1' }));
    await screen.findByRole('button', { name: 'Clicked — bolt 5' });
    expect(vibrate).toHaveBeenCalledTimes(1);

    reset();
    act(() => useRunnerSettings.getState().toggleVibrate());
    expect(screen.getByRole('checkbox', { name: 'Vibrate on each bolt' })).not.toBeChecked();
    expect(count('RunnerFooter')).toBe(1);
    expect(count('TorquePanel')).toBe(0);
    expect(count('PassRing')).toBe(0);

    // Past the double-tap guard (jsdom stamps an event with the clock's time).
    await act(() => new Promise((resolve) => setTimeout(resolve, DOUBLE_TAP_MS + 50)));
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 5' }));
    await screen.findByRole('button', { name: 'Clicked — bolt 3' });
    expect(vibrate).toHaveBeenCalledTimes(1);
    act(() => useRunnerSettings.getState().toggleVibrate());
  });
});

/**
 * The tap lab's page (tests/bench/tap-lab/run.ts): the real Runner at the torque passes of a
 * 24-bolt ring like bench:pages' (three staged passes and a check pass, a verified wrench), with
 * no server: the save answers after a phone's round trip, other phones' events are none.
 */
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createRoot } from 'react-dom/client';
import { Runner, type RunnerProps } from '@/features/runner/components/runner';
import type { ClientEvent, RunEvent } from '@/features/runner/events';
import { stepsFor } from '@/features/runner/steps';
import { tighteningSequence } from '@/features/torque-plan';

const N = 24;
const cross = tighteningSequence(N, { kind: 'cross' });
const seq = tighteningSequence(N, { kind: 'sequential' });
const plan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: N,
  passes: [
    { index: 1, kind: 'staged' as const, order: cross },
    { index: 2, kind: 'staged' as const, order: cross },
    { index: 3, kind: 'staged' as const, order: cross },
    { index: 4, kind: 'check' as const, order: seq },
  ],
};
const WRENCH = {
  id: '11111111-1111-4111-8111-111111111111',
  label: 'Blue click 20–200 in-lb',
  min: 20,
  max: 200,
  unit: 'lbf-in' as const,
  graduation: 1,
  kind: 'click' as const,
};
const out: RunEvent[] = [];
for (const step of plan.steps) {
  if (step.id === 'torque') break;
  if (step.id === 'hand_start')
    for (let bolt = 1; bolt <= N; bolt++) out.push({ type: 'hand_started', payload: { bolt } });
  out.push({ type: 'step_done', payload: { step: step.id, checklist: [] } } as RunEvent);
}
const t0 = Date.now() - 3_600_000;
const events = out.map(
  (e, i) =>
    ({
      ...e,
      clientId: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
      clientAt: new Date(t0 + i * 1000).toISOString(),
    }) as ClientEvent,
);
const now = new Date().toISOString();
const props: RunnerProps = {
  jobId: '2a7d1f0c-9b11-4c55-9f3e-6d3a0f7e1c1b',
  jobNumber: 41,
  wheel: {
    id: '6d3a0f7e-1c1b-4c55-9f3e-2a7d1f0c9b11',
    position: 'LF',
    tireSize: '30x10R14',
    directional: false,
    targetPressure: 14,
    pressureUnit: 'psi',
  },
  spec: { name: 'Bench 24', maxBeadSeatPressure: 30, pressureUnit: 'psi', lugTorque: null },
  plan,
  targets: [
    { value: 43.2, unit: 'lbf-in' },
    { value: 100.8, unit: 'lbf-in' },
    { value: 144, unit: 'lbf-in' },
    { value: 144, unit: 'lbf-in' },
  ] as RunnerProps['targets'],
  wrenches: [WRENCH],
  verifications: [43, 101, 144].map((v) => ({
    wrenchId: WRENCH.id,
    recordedAt: now,
    referenceValue: v,
    unit: 'lbf-in' as const,
  })),
  rules: {
    minFractionOfMax: 0.2,
    verification: { recency: 'same_day', days: 1, nearPercent: 0 },
    timeZone: 'UTC',
  },
  events,
  photos: [],
  // The server's answer after a phone's round trip.
  saveEvents: (_prev, { events: sent }) =>
    new Promise((resolve) =>
      setTimeout(() => resolve({ ok: true, data: { saved: sent.length, duplicates: 0 } }), 150),
    ),
  signInHref: '/sign-in',
  person: { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' },
  mayRecordVerifications: true,
};
createRoot(document.getElementById('root')!).render(
  <QueryClientProvider client={new QueryClient()}>
    <Runner {...props} />
  </QueryClientProvider>,
);

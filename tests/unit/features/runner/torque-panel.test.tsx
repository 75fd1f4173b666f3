// @vitest-environment jsdom
import { fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { HandStartPanel } from '@/features/runner/components/hand-start-panel';
import { TorquePanel } from '@/features/runner/components/torque-panel';
import type { ClientEvent, RunEvent } from '@/features/runner/events';
import { reduceRun, type RunnerPlan } from '@/features/runner/state';
import { stepsFor } from '@/features/runner/steps';
import type { CribWrench, WrenchRules } from '@/features/runner/wrench-gate';
import type { Torque } from '@/features/torque-plan';
import { CLICK_WRENCH } from '@/tests/helpers/runner-fixtures';

const plan: RunnerPlan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: 4,
  passes: [
    { index: 1, kind: 'staged', order: [1, 3, 2, 4] },
    { index: 2, kind: 'staged', order: [1, 3, 2, 4] },
    { index: 3, kind: 'check', order: [1, 2, 3, 4] },
  ],
};
const targets: Torque[] = [
  { value: 50, unit: 'lbf-ft' },
  { value: 100, unit: 'lbf-ft' },
  { value: 100, unit: 'lbf-ft' },
];
// Any point of the scale counts, verified today: the gate lets every pass through.
const rules: WrenchRules = {
  minFractionOfMax: 0.2,
  verification: { recency: 'same_day', days: 1, nearPercent: 0 },
  timeZone: 'UTC',
};

let n = 0;
function Harness({
  wrench = CLICK_WRENCH,
  initial = [],
  onRecord,
}: {
  wrench?: CribWrench;
  initial?: ClientEvent[];
  onRecord: (e: RunEvent) => void;
}) {
  const [events, setEvents] = useState<ClientEvent[]>(initial);
  const state = reduceRun(plan, events);
  const verifications = [
    {
      wrenchId: wrench.id,
      recordedAt: new Date().toISOString(),
      referenceValue: 60,
      unit: 'lbf-ft' as const,
    },
  ];
  const record = async (e: RunEvent) => {
    onRecord(e);
    n += 1;
    setEvents((all) => [
      ...all,
      {
        ...e,
        clientId: `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`,
        clientAt: new Date(Date.UTC(2026, 0, 1, 8, 0, n)).toISOString(),
      } as ClientEvent,
    ]);
  };
  return (
    <TorquePanel
      state={state}
      targets={targets}
      wrenches={[wrench]}
      verifications={verifications}
      rules={rules}
      cautions={[]}
      boltCount={4}
      record={record}
      flaggedBolts={state.flaggedBolts.map((f) => f.bolt)}
    />
  );
}

const done = (pass: number, bolts: number[]): ClientEvent[] =>
  bolts.map(
    (bolt, i) =>
      ({
        type: 'bolt_confirmed',
        payload: { pass, bolt },
        clientId: `00000000-0000-4000-9000-${String(pass * 100 + i).padStart(12, '0')}`,
        clientAt: new Date(Date.UTC(2026, 0, 1, 7, pass, i)).toISOString(),
      }) as ClientEvent,
  );

afterEach(() => vi.useRealTimers());

describe('the torque pass screen', () => {
  it('shows "Set <wrench> to <value>" and confirms no bolt until "Wrench set"', () => {
    const onRecord = vi.fn();
    render(<Harness onRecord={onRecord} />);
    expect(screen.getByRole('region', { name: 'Wrench setting' })).toHaveTextContent(
      'Set TW-1 to 50 ft-lb',
    );
    expect(screen.queryByRole('button', { name: /^Clicked — bolt/ })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    expect(screen.getByLabelText('Current setting')).toHaveTextContent('Set TW-1 to 50 ft-lb');
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 1' }));
    expect(onRecord).toHaveBeenCalledWith({
      type: 'bolt_confirmed',
      payload: {
        pass: 1,
        bolt: 1,
        wrenchId: CLICK_WRENCH.id,
        setting: { value: 50, unit: 'lbf-ft' },
      },
    });
  });

  it('"Wrench set" records the wrench in hand for the pass, once: after a reload the card asks again but records nothing new', () => {
    const onRecord = vi.fn();
    const first = render(<Harness onRecord={onRecord} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    const chosen = { type: 'wrench_chosen', payload: { pass: 1, wrenchId: CLICK_WRENCH.id } };
    expect(onRecord).toHaveBeenCalledWith(chosen);
    first.unmount();

    const afterReload = vi.fn();
    const held = [
      { ...chosen, clientId: crypto.randomUUID(), clientAt: '2026-01-01T07:59:00.000Z' },
    ];
    render(<Harness onRecord={afterReload} initial={held as ClientEvent[]} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    expect(afterReload).not.toHaveBeenCalled();
    expect(screen.getByRole('button', { name: 'Clicked — bolt 1' })).toBeInTheDocument();
  });

  it('shows the card again when the next pass changes the setting', () => {
    render(<Harness onRecord={() => {}} initial={done(1, [1, 3, 2])} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 4' }));
    expect(screen.getByRole('region', { name: 'Wrench setting' })).toHaveTextContent(
      'Set TW-1 to 100 ft-lb',
    );
    expect(screen.queryByRole('button', { name: /^Clicked — bolt/ })).toBeNull();
  });

  it('ignores a second tap within 400 ms of a confirmation, and takes one after', () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-01-01T08:00:00Z'));
    const onRecord = vi.fn();
    render(<Harness onRecord={onRecord} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    onRecord.mockClear(); // the wrench chosen; only the taps count below
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 1' }));
    vi.setSystemTime(new Date('2026-01-01T08:00:00.150Z'));
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 3' }));
    expect(onRecord).toHaveBeenCalledTimes(1);
    vi.setSystemTime(new Date('2026-01-01T08:00:00.600Z'));
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 3' }));
    expect(onRecord).toHaveBeenCalledTimes(2);
    expect(onRecord).toHaveBeenLastCalledWith(
      expect.objectContaining({ payload: expect.objectContaining({ bolt: 3 }) }),
    );
  });

  it.each([
    ['click', 'Clicked — bolt 1'],
    ['beam', 'Reached — bolt 1'],
    ['dial', 'Reached — bolt 1'],
    ['digital', 'Reached — bolt 1'],
  ] as const)('a %s wrench: the button says "%s"', (kind, words) => {
    render(<Harness onRecord={() => {}} wrench={{ ...CLICK_WRENCH, kind }} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    expect(screen.getByRole('button', { name: words })).toBeInTheDocument();
  });

  it('"Undo last bolt" takes back the last confirmation in one tap', () => {
    const onRecord = vi.fn();
    render(<Harness onRecord={onRecord} initial={done(1, [1, 3])} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    fireEvent.click(screen.getByRole('button', { name: 'Undo last bolt (3)' }));
    expect(onRecord).toHaveBeenCalledWith({ type: 'bolt_undone', payload: { pass: 1, bolt: 3 } });
  });

  it('"Problem with this bolt" sends bolt_flagged and the wheel stops with the bolt named', async () => {
    const onRecord = vi.fn();
    render(<Harness onRecord={onRecord} initial={done(1, [1])} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    fireEvent.click(screen.getByRole('button', { name: 'Problem with this bolt' }));
    // The form loads when it is asked for (not part of the runner's first load).
    const stop = await screen.findByRole('button', { name: 'Stop the wheel and flag it' });
    expect(stop).toBeDisabled();
    fireEvent.click(screen.getByRole('radio', { name: 'Stripped thread' }));
    fireEvent.change(screen.getByLabelText(/^Note/), {
      target: { value: 'threads came out with the bolt' },
    });
    fireEvent.click(stop);
    expect(onRecord).toHaveBeenCalledWith({
      type: 'bolt_flagged',
      payload: { bolt: 3, pass: 1, problem: 'stripped', note: 'threads came out with the bolt' },
    });
  });

  it('a check pass asks whether each bolt turned, and a bolt that turned adds another check pass', () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    let t = Date.UTC(2026, 0, 1, 9);
    vi.setSystemTime(t);
    const onRecord = vi.fn();
    render(
      <Harness
        onRecord={onRecord}
        initial={[...done(1, [1, 3, 2, 4]), ...done(2, [1, 3, 2, 4])]}
      />,
    );
    expect(screen.getByRole('region', { name: 'Wrench setting' })).toHaveTextContent('Check pass');
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    expect(screen.getByText('Bolt 1: did it turn before the wrench clicked?')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Turned' }));
    expect(onRecord).toHaveBeenLastCalledWith(
      expect.objectContaining({
        payload: expect.objectContaining({ pass: 3, bolt: 1, turned: true }),
      }),
    );
    for (const bolt of [2, 3, 4]) {
      vi.setSystemTime((t += 1_000));
      expect(
        screen.getByText(`Bolt ${bolt}: did it turn before the wrench clicked?`),
      ).toBeInTheDocument();
      fireEvent.click(screen.getByRole('button', { name: "Didn't turn" }));
    }
    // Bolt 1 turned: another check pass at the same setting, announced like any pass.
    expect(screen.getByRole('region', { name: 'Wrench setting' })).toHaveTextContent(
      'Check pass 2',
    );
    expect(screen.queryByRole('button', { name: 'Torque passes done' })).toBeNull();
  });
});

describe('hand-start', () => {
  it('suggests the cross order and flags a bolt from there too', async () => {
    const record = vi.fn(async () => {});
    render(<HandStartPanel boltCount={8} started={[1]} next={5} cautions={[]} record={record} />);
    expect(screen.getByText('Press the ring down to start the next bolt.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Bolt 5 started by hand' })).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Problem with this bolt' }));
    fireEvent.click(await screen.findByRole('radio', { name: 'Cross-threaded' }));
    fireEvent.click(screen.getByRole('button', { name: 'Stop the wheel and flag it' }));
    expect(record).toHaveBeenCalledWith({
      type: 'bolt_flagged',
      payload: { bolt: 5, problem: 'cross_threaded' },
    });
  });
});

// @vitest-environment jsdom
import { fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { TorquePanel } from '@/features/runner/components/torque-panel';
import type { ClientEvent, RunEvent } from '@/features/runner/events';
import type { PassPractice } from '@/features/runner/practice-mode';
import { reduceRun, type RunnerPlan } from '@/features/runner/state';
import { stepsFor } from '@/features/runner/steps';
import type { CribWrench, WrenchRules } from '@/features/runner/wrench-gate';
import type { Torque } from '@/features/torque-plan';

const FT: CribWrench = {
  id: '11111111-1111-4111-8111-111111111111',
  label: '20–150 ft-lb click',
  min: 20,
  max: 150,
  unit: 'lbf-ft',
  graduation: 1,
  kind: 'click',
};
const IN: CribWrench = {
  id: '22222222-2222-4222-8222-222222222222',
  label: '40–200 in-lb click',
  min: 40,
  max: 200,
  unit: 'lbf-in',
  graduation: 1,
  kind: 'click',
};
const plan: RunnerPlan = {
  steps: stepsFor({ dismount: true, reinstall: false }),
  boltCount: 8,
  passes: [
    { index: 1, kind: 'staged', order: [1, 5, 3, 7, 2, 6, 4, 8] },
    { index: 2, kind: 'check', order: [1, 2, 3, 4, 5, 6, 7, 8] },
  ],
};
const targets: Torque[] = [
  { value: 60, unit: 'lbf-ft' },
  { value: 60, unit: 'lbf-ft' },
];
// No verification anywhere: practice never asks for one (nothing touches the tool crib).
const rules: WrenchRules = {
  minFractionOfMax: 0.2,
  verification: { recency: 'same_day', days: 1, nearPercent: 25 },
  timeZone: 'UTC',
};

let n = 0;
function Harness({
  practice,
  onRecord,
}: {
  practice: PassPractice;
  onRecord: (e: RunEvent) => void;
}) {
  const [events, setEvents] = useState<ClientEvent[]>([]);
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
      state={reduceRun(plan, events)}
      targets={targets}
      wrenches={[FT, IN]}
      verifications={[]}
      rules={rules}
      cautions={['Stand clear.']}
      boltCount={8}
      record={record}
      practice={practice}
    />
  );
}

describe('the torque pass screen in practice', () => {
  it('guided: the setting card as on a real wheel, and no verification asked for', () => {
    render(<Harness practice={{ level: 'guided' }} onRecord={() => {}} />);
    expect(screen.getByRole('region', { name: 'Wrench setting' })).toHaveTextContent(
      'Set 20–150 ft-lb click to 60 ft-lb',
    );
    expect(screen.queryByText(/verif/i)).toBeNull();
  });

  it('from memory: no next bolt or turn order shown; the bolt tapped is recorded, even out of sequence', () => {
    const onRecord = vi.fn();
    render(<Harness practice={{ level: 'from_memory' }} onRecord={onRecord} />);
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    expect(screen.queryByText(/next: bolt/)).toBeNull();
    expect(screen.queryByRole('button', { name: /in order/ })).toBeNull();
    expect(screen.queryByRole('button', { name: /, next/ })).toBeNull();
    expect(screen.getByText('Tap the bolt you would tighten next.')).toBeInTheDocument();
    // Bolt 2 where bolt 1 is due: taken as tapped, with nothing on screen calling it wrong.
    fireEvent.click(screen.getByRole('button', { name: /^bolt 2,/ }));
    expect(screen.queryByText(/out of sequence/)).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 2' }));
    expect(onRecord).toHaveBeenLastCalledWith({
      type: 'bolt_confirmed',
      payload: { pass: 1, bolt: 2, wrenchId: FT.id, setting: { value: 60, unit: 'lbf-ft' } },
    });
  });

  it('wrench setup: no setting shown; the wrench picked and the setting typed go with each bolt', async () => {
    const onRecord = vi.fn();
    render(<Harness practice={{ level: 'wrench_setup' }} onRecord={onRecord} />);
    const card = await screen.findByRole('region', { name: 'Wrench setting' });
    expect(card).not.toHaveTextContent('Set 20–150');
    expect(screen.getByRole('button', { name: 'Wrench set' })).toBeDisabled();
    // The in-lb wrench and 720 in-lb (60 ft-lb × 12 in per ft, NIST SP 811: 1 ft = 12 in) — past
    // its range; the score judges it afterwards, the screen takes it as typed.
    fireEvent.change(screen.getByLabelText('Wrench'), { target: { value: IN.id } });
    fireEvent.change(screen.getByLabelText(/^Setting/), { target: { value: '720' } });
    fireEvent.click(screen.getByRole('button', { name: 'Wrench set' }));
    expect(onRecord).toHaveBeenCalledWith({
      type: 'wrench_chosen',
      payload: { pass: 1, wrenchId: IN.id },
    });
    expect(screen.getByLabelText('Current setting')).toHaveTextContent(
      'Set 40–200 in-lb click to 720 in-lb',
    );
    fireEvent.click(screen.getByRole('button', { name: 'Clicked — bolt 1' }));
    expect(onRecord).toHaveBeenLastCalledWith({
      type: 'bolt_confirmed',
      payload: { pass: 1, bolt: 1, wrenchId: IN.id, setting: { value: 720, unit: 'lbf-in' } },
    });
  });
});

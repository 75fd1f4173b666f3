// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { AnomalyList } from '@/features/review/components/anomaly-list';
import type { Anomaly } from '@/features/review/types';

vi.mock('next/navigation', () => ({ useRouter: () => ({ refresh: vi.fn() }) }));
const { DecidePanel } = await import('@/features/review/components/decide-panel');

const anomalies: Anomaly[] = [
  {
    key: 'too_fast:w1:2:',
    code: 'too_fast',
    severity: 'blocks',
    wheelId: 'w1',
    pass: 2,
    message:
      "LF wheel: pass 2 of 3 (70 %, 14 ft-lb) was confirmed at a median of 0.4 s per bolt, faster than the shop's 1.5 s.",
  },
  {
    key: 'step_skipped:w1:-:clean',
    code: 'step_skipped',
    severity: 'notes',
    wheelId: 'w1',
    message: 'LF wheel: step "Clean" was skipped: new ring.',
  },
];

describe('AnomalyList', () => {
  it('says in words which anomaly blocks sign-off and which is a note', () => {
    render(<AnomalyList anomalies={anomalies} />);
    const items = within(screen.getByRole('list', { name: 'Anomalies' })).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual([
      "■ Blocks sign-offLF wheel: pass 2 of 3 (70 %, 14 ft-lb) was confirmed at a median of 0.4 s per bolt, faster than the shop's 1.5 s.",
      '● NoteLF wheel: step "Clean" was skipped: new ring.',
    ]);
  });

  it('says so when the record has none', () => {
    render(<AnomalyList anomalies={[]} />);
    expect(screen.getByText(/No anomalies/)).toBeInTheDocument();
    expect(screen.queryByRole('list')).toBeNull();
  });
});

describe('DecidePanel', () => {
  const props = {
    jobId: 'j1',
    refusal: null,
    selfReview: false,
    wheels: [{ id: 'w1', position: 'LF' }],
    steps: [{ id: 'torque', title: 'Torque passes' }],
    sendBack: vi.fn(),
  };

  it("sends the lead's reason with each blocking anomaly's key, and shows the server's refusal at the anomaly", async () => {
    const approve = vi.fn().mockResolvedValue({
      ok: false,
      message: 'Acknowledge every anomaly that blocks sign-off with a reason first.',
      fieldErrors: {
        'acknowledgements.too_fast:w1:2:': ['Say why this is acceptable before signing off.'],
      },
    });
    render(
      <DecidePanel
        {...props}
        approve={approve}
        blocking={[{ key: anomalies[0]!.key, message: anomalies[0]!.message }]}
      />,
    );
    await userEvent.click(screen.getByRole('button', { name: 'Sign off' }));
    expect(
      await screen.findByText('Say why this is acceptable before signing off.'),
    ).toBeInTheDocument();
    await userEvent.type(
      screen.getByLabelText(/Acknowledge 1: LF wheel: pass 2 of 3/),
      'watched the passes myself',
    );
    await userEvent.click(screen.getByRole('button', { name: 'Sign off' }));
    expect(approve).toHaveBeenLastCalledWith(null, {
      jobId: 'j1',
      note: '',
      acknowledgements: [{ key: 'too_fast:w1:2:', reason: 'watched the passes myself' }],
    });
  });

  it('sends back only the wheels ticked, each with its note and steps', async () => {
    const sendBack = vi
      .fn()
      .mockResolvedValue({ ok: true, message: 'Sent back to the technician.' });
    render(<DecidePanel {...props} sendBack={sendBack} approve={vi.fn()} blocking={[]} />);
    await userEvent.click(screen.getByLabelText('Send back the LF wheel'));
    await userEvent.type(
      screen.getByLabelText('What to redo on the LF wheel'),
      'Redo pass 2 at a steady pace.',
    );
    await userEvent.click(screen.getByLabelText('Torque passes'));
    await userEvent.click(screen.getByRole('button', { name: 'Send back' }));
    expect(sendBack).not.toHaveBeenCalled(); // the dialog asks first, naming the wheel
    await userEvent.click(screen.getByRole('button', { name: 'Send back the LF wheel' }));
    expect(sendBack).toHaveBeenCalledTimes(1);
    expect(sendBack).toHaveBeenCalledWith(null, {
      jobId: 'j1',
      wheels: [{ wheelId: 'w1', note: 'Redo pass 2 at a steady pace.', steps: ['torque'] }],
    });
    expect(await screen.findByRole('status')).toHaveTextContent('Sent back to the technician.');
  });

  it('explains why the lead cannot decide instead of offering the buttons', () => {
    render(
      <DecidePanel
        {...props}
        refusal="You worked on this job card: another lead must sign it off or send it back."
        approve={vi.fn()}
        blocking={[]}
      />,
    );
    expect(screen.getByText(/another lead must sign it off/)).toBeInTheDocument();
    expect(screen.queryByRole('button')).toBeNull();
  });
});

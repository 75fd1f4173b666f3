// @vitest-environment jsdom
import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { StepPanel } from '@/features/runner/components/step-panel';
import { stepsFor } from '@/features/runner/steps';

const steps = stepsFor({ dismount: true, reinstall: true });
const step = (id: string) => steps.find((s) => s.id === id)!;

describe('the procedure', () => {
  it('cleans and deburrs before the inspection, and seats the inner bead with the strap off before finishing inflation', () => {
    expect(steps.map((s) => s.id)).toEqual([
      'safety',
      'dismount',
      'clean',
      'inspect',
      'mount',
      'index',
      'hand_start',
      'torque',
      'seat_bead',
      'leak_check',
      'reinstall',
      'submit',
    ]);
    const seat = step('seat_bead').checklist.map((c) => c.text);
    expect(seat).toContain('Inner bead seated.');
    expect(seat.join(' ')).not.toMatch(/both beads/i);
    expect(step('seat_bead').cautions.join(' ')).toMatch(/not a restraint/);
    expect(step('leak_check').checklist.map((c) => c.id)).toEqual(['core-in', 'inflated', 'soapy']);
  });
});

describe('readings', () => {
  it('"Pressure set" more than 1 psi off the wheel\'s target asks for a re-check before the step is done', () => {
    const record = vi.fn(async () => {});
    render(
      <StepPanel
        step={step('leak_check')}
        record={record}
        readingUnit="psi"
        target={{ value: 8, unit: 'psi' }}
      />,
    );
    for (const box of screen.getAllByRole('checkbox')) fireEvent.click(box);
    fireEvent.change(screen.getByLabelText('Pressure set'), { target: { value: '10' } });
    expect(screen.getByRole('alert')).toHaveTextContent("2.0 psi over the wheel's target (8 psi)");
    expect(screen.getByRole('button', { name: 'Step done' })).toBeDisabled();
    fireEvent.click(
      screen.getByRole('checkbox', { name: 'Re-checked: this is the pressure now.' }),
    );
    expect(screen.getByRole('button', { name: 'Step done' })).toBeEnabled();
    fireEvent.change(screen.getByLabelText('Pressure set'), { target: { value: '8.5' } });
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('the bead-seat limit is shown in the unit being typed', () => {
    render(
      <StepPanel
        step={step('seat_bead')}
        record={vi.fn(async () => {})}
        readingUnit="psi"
        limit={{ value: 30, unit: 'psi' }}
      />,
    );
    expect(screen.getByText('At most 30 psi.')).toBeInTheDocument();
    fireEvent.change(screen.getByRole('combobox', { name: 'Pressure unit' }), {
      target: { value: 'kPa' },
    });
    // 30 psi × 6.894 757 kPa/psi = 206.8 kPa (NIST SP 811, App. B).
    expect(screen.getByText('At most 206.8 kPa.')).toBeInTheDocument();
  });

  it('a bead that will not seat by the limit is stopped and flagged with the truth, not typed lower to get past', () => {
    const record = vi.fn(async () => {});
    render(
      <StepPanel
        step={step('seat_bead')}
        record={record}
        readingUnit="psi"
        limit={{ value: 30, unit: 'psi' }}
      />,
    );
    fireEvent.change(screen.getByLabelText(/pressure/i, { selector: 'input' }), {
      target: { value: '30' },
    });
    fireEvent.click(screen.getByRole('button', { name: /Bead won.t seat at the limit/ }));
    fireEvent.change(screen.getByLabelText(/did not seat by 30 psi/), {
      target: { value: 'Let the air out; bead lube dried, tire cold' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Stop this wheel and flag it' }));
    expect(record).toHaveBeenCalledWith({
      type: 'inspection_failed',
      payload: {
        notes:
          'Bead did not seat by the limit (30 psi); gauge read 30 psi: Let the air out; bead lube dried, tire cold',
      },
    });
  });
});

// @vitest-environment jsdom
import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

vi.mock('@/features/specs/actions/save-spec', () => ({
  createWheelSpec: vi.fn(),
  updateWheelSpec: vi.fn(),
}));
const { SpecForm } = await import('@/features/specs/components/spec-form');

const wrenches = [
  {
    id: 'w1',
    label: 'Blue click 20–200 in-lb',
    min: 20,
    max: 200,
    unit: 'lbf-in' as const,
    graduation: 1,
    kind: 'click' as const,
  },
  {
    id: 'w2',
    label: 'Grey click 5–80 ft-lb',
    min: 5,
    max: 80,
    unit: 'lbf-ft' as const,
    graduation: 1,
    kind: 'click' as const,
  },
];

/** The product's defaults for a new shop: a 20 % wrench floor, ft-lb and psi. */
const shop = { minFractionOfMax: 0.2, units: { torque: 'lbf-ft', pressure: 'psi' } } as const;

async function fill(values: Record<string, string>) {
  for (const [label, value] of Object.entries(values)) {
    const field = screen.getByLabelText(label);
    await userEvent.clear(field);
    await userEvent.type(field, value);
  }
}

describe('SpecForm', () => {
  it('previews the sequence and each pass’s wrench and setting as the spec is typed', async () => {
    render(<SpecForm wrenches={wrenches} {...shop} />);
    await fill({
      'Spec name': 'Test ring',
      'Bolt count': '16',
      'Ring bolt thread': 'M8×1.25',
      'Final torque': '12',
      'Maximum bead-seating pressure': '30',
      'Running pressure': '14',
    });
    expect(
      await screen.findByText(
        '1 · 9 · 5 · 13 · 3 · 11 · 7 · 15 · 2 · 10 · 6 · 14 · 4 · 12 · 8 · 16',
      ),
    ).toBeInTheDocument();
    const pass1 = screen.getByRole('row', { name: /Pass 1 \(30 %\)/ });
    expect(pass1).toHaveTextContent('Blue click 20–200 in-lb set to 43 in-lb');
  });

  it('shows the engine’s refusal at the field it concerns', async () => {
    render(<SpecForm wrenches={wrenches} {...shop} />);
    await fill({
      'Spec name': 'Too many',
      'Bolt count': '70',
      'Ring bolt thread': 'M8',
      'Final torque': '12',
      'Maximum bead-seating pressure': '30',
      'Running pressure': '14',
    });
    const count = screen.getByLabelText('Bolt count');
    expect(count).toHaveAttribute('aria-invalid', 'true');
    expect(count).toHaveAccessibleDescription(/The bolt count must be from 4 to 64; got 70\./);

    await fill({ 'Bolt count': '20', 'Passes (% of final)': '70, 30, 100' });
    fireEvent.change(screen.getByLabelText('Passes (% of final)'));
    expect(screen.getByLabelText('Passes (% of final)')).toHaveAccessibleDescription(
      /Each pass must be at least the one before \(a repeated pass is fine\)\./,
    );
    expect(screen.getByLabelText('Bolt count')).not.toHaveAttribute('aria-invalid');
  });

  it('refuses a bead-seating limit in bar as it is typed, naming psi (35 bar is 507.6 psi: NIST SP 811 App. B; 40 psi: tire industry bead-seating guidance)', async () => {
    render(<SpecForm wrenches={wrenches} {...shop} />);
    await userEvent.selectOptions(screen.getByLabelText('Pressure unit'), 'bar');
    await fill({ 'Maximum bead-seating pressure': '35' });
    const seat = screen.getByLabelText('Maximum bead-seating pressure');
    expect(seat).toHaveAttribute('aria-invalid', 'true');
    expect(seat).toHaveAccessibleDescription(
      /35 bar is 507\.6 psi: above the 40 psi bead-seating ceiling/,
    );
    // Nothing is said yet about fields not typed.
    expect(screen.getByLabelText('Running pressure')).not.toHaveAttribute('aria-invalid');

    await fill({ 'Maximum bead-seating pressure': '2.4', 'Running pressure': '0.7' });
    expect(seat).not.toHaveAttribute('aria-invalid');
    // More than 3× the running pressure (common practice, no source): a warning, not a refusal.
    expect(seat).toHaveAccessibleDescription(
      /Check: The bead-seating limit \(2\.4 bar\) is more than 3× the running pressure \(0\.7 bar\)/,
    );
  });

  it('warns at the final torque when it looks like a unit slip (5–40 ft-lb for ring bolts: common practice, no source)', async () => {
    render(<SpecForm wrenches={wrenches} {...shop} />);
    await fill({ 'Final torque': '96' });
    expect(screen.getByLabelText('Final torque')).toHaveAccessibleDescription(
      /Check: 96 ft-lb is 130\.2 N·m: outside the usual 5–40 ft-lb/,
    );
    expect(screen.getByLabelText('Final torque')).not.toHaveAttribute('aria-invalid');
  });

  it('a skip step of N or more is refused at the skip step', async () => {
    render(<SpecForm wrenches={wrenches} {...shop} />);
    await fill({
      'Spec name': 'Skip',
      'Bolt count': '20',
      'Ring bolt thread': 'M8',
      'Final torque': '12',
      'Maximum bead-seating pressure': '30',
      'Running pressure': '14',
    });
    await userEvent.selectOptions(screen.getByLabelText('Tightening pattern'), 'skip');
    await fill({ 'Skip step (skip pattern only)': '20' });
    expect(screen.getByLabelText('Skip step (skip pattern only)')).toHaveAccessibleDescription(
      /skip step must be from 1 to 19/,
    );
  });

  it("previews with the shop's wrench floor: a 5–80 ft-lb wrench takes a 10 ft-lb pass at 0 %, not at 20 %", async () => {
    const grey = [wrenches[1]!];
    const typed = {
      'Spec name': 'Test ring',
      'Bolt count': '16',
      'Ring bolt thread': 'M8×1.25',
      'Final torque': '10',
      'Maximum bead-seating pressure': '30',
      'Running pressure': '14',
    };
    const { unmount } = render(<SpecForm wrenches={grey} {...shop} />);
    await fill(typed);
    // 10 ft-lb is 12.5 % of 80: below a 20 % floor (16 ft-lb).
    expect(await screen.findByRole('row', { name: /Pass 3 \(100 %\)/ })).toHaveTextContent(
      /No wrench: .*below the shop's floor of 20 %/,
    );
    unmount();
    render(<SpecForm wrenches={grey} {...shop} minFractionOfMax={0} />);
    await fill(typed);
    expect(await screen.findByRole('row', { name: /Pass 3 \(100 %\)/ })).toHaveTextContent(
      'Grey click 5–80 ft-lb set to 10 ft-lb',
    );
  });

  it("a new spec starts in the shop's own units", () => {
    render(
      <SpecForm
        wrenches={wrenches}
        minFractionOfMax={0.2}
        units={{ torque: 'Nm', pressure: 'bar' }}
      />,
    );
    expect(screen.getAllByLabelText('Unit').map((u) => (u as HTMLSelectElement).value)).toEqual([
      'Nm',
      'Nm',
    ]);
    expect(screen.getByLabelText<HTMLSelectElement>('Pressure unit').value).toBe('bar');
  });
});

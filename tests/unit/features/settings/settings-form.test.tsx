// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { settingsFormSchema } from '@/features/settings/schemas';

const saveSettings = vi.fn();
vi.mock('@/features/settings/actions/save-settings', () => ({
  saveSettings: (...args: unknown[]) => saveSettings(...args),
}));
const { SettingsForm } = await import('@/features/settings/components/settings-form');

const defaults = {
  timeZone: 'UTC',
  wrenchFloorPercent: 20,
  verification: { recency: 'same_day' as const, days: 1, nearPercent: 25 },
  tooFastSecondsPerBolt: 1.5,
  recheckDays: 7,
  pressureUnit: 'psi' as const,
  torqueUnit: 'lbf-ft' as const,
  singleLeadSelfSignoff: false,
};

describe('SettingsForm', () => {
  it('sends what the page shows, in the API shape, and confirms the save', async () => {
    saveSettings.mockImplementation(async (_prev: unknown, form: FormData) => ({
      ok: true,
      data: settingsFormSchema.parse(Object.fromEntries(form)),
    }));
    render(<SettingsForm settings={defaults} timeZones={['America/Denver', 'UTC']} />);
    await userEvent.clear(screen.getByLabelText('Wrench floor (% of maximum)'));
    await userEvent.type(screen.getByLabelText('Wrench floor (% of maximum)'), '0');
    await userEvent.selectOptions(
      screen.getByLabelText('Verification must be from'),
      'within_days',
    );
    await userEvent.clear(screen.getByLabelText('Number of days'));
    await userEvent.type(screen.getByLabelText('Number of days'), '3');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByRole('status')).toHaveTextContent('Settings saved.');
    const sent = settingsFormSchema.parse(
      Object.fromEntries(saveSettings.mock.calls[0]![1] as FormData),
    );
    expect(sent).toEqual({
      timeZone: 'UTC',
      wrenchFloorPercent: 0,
      verification: { recency: 'within_days', days: 3, nearPercent: 25 },
      tooFastSecondsPerBolt: 1.5,
      recheckDays: 7,
      pressureUnit: 'psi',
      torqueUnit: 'lbf-ft',
      singleLeadSelfSignoff: false,
    });
  });

  it('the number of days is asked only when the rule is "the last few days"', async () => {
    render(<SettingsForm settings={defaults} timeZones={['UTC']} />);
    expect(screen.queryByLabelText('Number of days')).toBeNull();
    await userEvent.selectOptions(
      screen.getByLabelText('Verification must be from'),
      'within_days',
    );
    expect(screen.getByLabelText('Number of days')).toHaveAccessibleDescription(
      '1 is today only; 7 is today and the six days before.',
    );
  });

  it("shows the server's refusal at the field it names", async () => {
    saveSettings.mockResolvedValueOnce({
      ok: false,
      message: 'Check the highlighted fields.',
      fieldErrors: {
        'verification.nearPercent': [
          'How near the working point must be from 0 to 100 % (0 = any point).',
        ],
      },
      values: { 'verification.nearPercent': '250' },
    });
    render(<SettingsForm settings={defaults} timeZones={['UTC']} />);
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    const near = await screen.findByLabelText('Verified near the setting (± %)');
    expect(near).toHaveAttribute('aria-invalid', 'true');
    expect(near).toHaveAccessibleDescription(/must be from 0 to 100 %/);
    expect(near).toHaveValue('250');
  });
});

// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

const cancel = vi.fn();
vi.mock('@/features/follow-up/actions/follow-up-actions', () => ({
  cancelRecheckReminder: (...args: unknown[]) => cancel(...args),
  rescheduleRecheckReminder: vi.fn(),
  sendCustomerEmailAgain: vi.fn(),
}));
const { FollowUpPanel } = await import('@/features/follow-up/components/follow-up-panel');

const followUp = {
  recheck: { dueOn: '2026-12-08', status: 'scheduled' as const, lastError: null, sentAt: null },
  customerEmail: {
    to: 'wren@example.test',
    status: 'failed' as const,
    attempts: 6,
    lastError: '554 5.7.1 relay refused',
    sentAt: null,
  },
};

describe('FollowUpPanel', () => {
  it('shows a lead the failed e-mail with its reason and Send again, the reminder’s day with Reschedule and Cancel', async () => {
    cancel.mockResolvedValue({ ok: true, data: { message: 'Re-check reminder cancelled.' } });
    render(<FollowUpPanel jobId="j1" followUp={followUp} canManage timeZone="America/Denver" />);
    const email = screen.getByTestId('customer-email-status');
    expect(email).toHaveTextContent('Failed to wren@example.test');
    expect(email).toHaveTextContent('Reason: 554 5.7.1 relay refused');
    expect(within(email).getByRole('button', { name: 'Send again' })).toBeVisible();
    const recheck = screen.getByTestId('recheck-status');
    expect(recheck).toHaveTextContent('Scheduled · due Dec 8, 2026');
    expect(within(recheck).getByLabelText('Re-check due on')).toHaveValue('2026-12-08');
    await userEvent.click(within(recheck).getByRole('button', { name: 'Cancel reminder' }));
    expect(cancel).not.toHaveBeenCalled(); // asked first
    await userEvent.click(screen.getByRole('button', { name: 'Cancel the reminder' }));
    expect(await screen.findByText('Re-check reminder cancelled.')).toBeVisible();
    expect((cancel.mock.calls[0]![1] as FormData).get('jobId')).toBe('j1');
  });

  it('shows a technician the same facts without any control', () => {
    render(
      <FollowUpPanel jobId="j1" followUp={followUp} canManage={false} timeZone="America/Denver" />,
    );
    expect(screen.getByTestId('recheck-status')).toHaveTextContent('Scheduled · due Dec 8, 2026');
    expect(screen.queryByRole('button')).toBeNull();
  });

  it('says when nothing was sent for want of an address, and a sent reminder shows when it went, in the shop’s time', () => {
    render(
      <FollowUpPanel
        jobId="j1"
        followUp={{
          customerEmail: null,
          recheck: {
            dueOn: '2026-12-08',
            status: 'sent',
            lastError: null,
            sentAt: '2026-12-08T16:00:05Z',
          },
        }}
        canManage={false}
        timeZone="America/Denver"
      />,
    );
    expect(screen.getByTestId('customer-email-status')).toHaveTextContent(
      'Not sent: no e-mail address on file at sign-off.',
    );
    // 16:00 UTC is 09:00 in Denver in December (MST, UTC−7).
    expect(screen.getByTestId('recheck-status')).toHaveTextContent(/sent Dec 8, 2026,? 9:00/);
  });
});

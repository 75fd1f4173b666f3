import { formatShopDay, formatShopTime } from '@/features/ui/shop-time';
import type { FollowUp } from '../server/status';
import { RecheckControls, SendAgainButton } from './follow-up-controls';

const RECHECK_WORDS = {
  scheduled: 'Scheduled',
  sent: 'Sent',
  failed: 'Failed',
  cancelled: 'Cancelled',
} as const;
const EMAIL_WORDS = { queued: 'Waiting to send', sent: 'Sent', failed: 'Failed' } as const;

/**
 * After sign-off: the customer's completion e-mail and the ring-bolt re-check reminder, with a
 * lead's controls. Dates and times on the shop's calendar and clock.
 */
export function FollowUpPanel({
  jobId,
  followUp,
  canManage,
  timeZone,
}: {
  jobId: string;
  followUp: FollowUp;
  canManage: boolean;
  timeZone: string;
}) {
  const { recheck, customerEmail: email } = followUp;
  return (
    <section aria-labelledby="follow-up-title" className="flex flex-col gap-4">
      <h2 id="follow-up-title" className="text-xl font-bold">
        Customer follow-up
      </h2>
      <div className="flex flex-col gap-2" data-testid="customer-email-status">
        <h3 className="font-semibold">Customer e-mail</h3>
        {email ? (
          <>
            <p>
              {EMAIL_WORDS[email.status]} to {email.to}
              {email.sentAt ? ` · ${formatShopTime(email.sentAt, timeZone, 'dateTime')}` : ''}
            </p>
            {email.lastError ? (
              <p
                className={
                  email.status === 'failed' ? 'text-danger font-semibold' : 'text-ink-soft'
                }
              >
                {email.status === 'failed' ? 'Reason: ' : 'Last try failed, retrying: '}
                {email.lastError}
              </p>
            ) : null}
          </>
        ) : (
          <p className="text-ink-soft">Not sent: no e-mail address on file at sign-off.</p>
        )}
        {canManage && email?.status !== 'queued' ? <SendAgainButton jobId={jobId} /> : null}
      </div>
      <div className="flex flex-col gap-2" data-testid="recheck-status">
        <h3 className="font-semibold">Ring-bolt re-check reminder</h3>
        {recheck ? (
          <>
            <p>
              {RECHECK_WORDS[recheck.status]} · due {formatShopDay(recheck.dueOn)}
              {recheck.sentAt
                ? ` · sent ${formatShopTime(recheck.sentAt, timeZone, 'dateTime')}`
                : ''}
            </p>
            {recheck.lastError ? (
              <p
                className={
                  recheck.status === 'failed' ? 'text-danger font-semibold' : 'text-ink-soft'
                }
              >
                {recheck.status === 'failed' ? 'Reason: ' : 'Last try failed, retrying: '}
                {recheck.lastError}
              </p>
            ) : null}
            {canManage ? (
              <RecheckControls
                jobId={jobId}
                dueOn={recheck.dueOn}
                canCancel={recheck.status === 'scheduled'}
              />
            ) : null}
          </>
        ) : (
          <p className="text-ink-soft">None scheduled.</p>
        )}
      </div>
    </section>
  );
}

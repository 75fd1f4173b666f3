import 'server-only';
import { deliverInvite } from '@/features/accounts/server/invites';
import {
  deliverRecheckReminder,
  deliverReportEmail,
  type ReportEmailComposer,
  type ReportLinkWithdrawer,
} from '@/features/follow-up/server/deliver';
import {
  composeCustomerReportEmail,
  withdrawUnsentReportLink,
} from '@/features/reports/server/customer-email';
import { sweepAllShops } from '@/features/tool-crib/server/wrenches';
import { deliverTransitionNotices } from '@/server/mail/job-notices';
import { sendMail, type OutgoingMail } from '@/server/mail/mailer';
import type { QueueHandlers } from '@/server/queue/jobs';

/** Where the queue's handlers meet the features they call (features never import each other). */
export type WorkerDeps = {
  send: (mail: OutgoingMail) => Promise<void>;
  composeReportEmail: ReportEmailComposer;
  withdrawReportLink: ReportLinkWithdrawer;
};

export const defaultDeps: WorkerDeps = {
  send: sendMail,
  composeReportEmail: composeCustomerReportEmail,
  withdrawReportLink: withdrawUnsentReportLink,
};

export function queueHandlers(deps: WorkerDeps = defaultDeps): QueueHandlers {
  return {
    'recheck-reminder': async (data, attempt) => {
      await deliverRecheckReminder(data, attempt, deps.send);
    },
    'customer-report-email': async (data, attempt) => {
      await deliverReportEmail(data, attempt, {
        compose: deps.composeReportEmail,
        send: deps.send,
        withdrawLink: deps.withdrawReportLink,
      });
    },
    'job-notice': (data) => deliverTransitionNotices(data, deps.send),
    'invite-email': (data, attempt) => deliverInvite(data, attempt, deps.send),
    'wrench-overdue-sweep': () => sweepAllShops(),
  };
}

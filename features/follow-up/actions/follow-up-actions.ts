'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { followUpJobSchema, rescheduleSchema } from '../schemas';
import { cancelRecheck, rescheduleRecheck, resendReportEmail } from '../server/control';

const refresh = (jobId: string) => revalidatePath(`/jobs/${jobId}`);

export const cancelRecheckReminder = memberAction(
  { permission: 'followup.manage', schema: followUpJobSchema },
  async ({ jobId }, member) => {
    const followUp = await cancelRecheck(member, jobId);
    refresh(jobId);
    return { followUp, message: 'Re-check reminder cancelled.' };
  },
);

export const rescheduleRecheckReminder = memberAction(
  { permission: 'followup.manage', schema: rescheduleSchema },
  async ({ jobId, dueOn }, member) => {
    const followUp = await rescheduleRecheck(member, jobId, dueOn);
    refresh(jobId);
    const failed = followUp.recheck?.status === 'failed';
    return {
      followUp,
      message: failed
        ? `The reminder could not be queued (${followUp.recheck?.lastError ?? 'no reason given'}); try again shortly.`
        : 'Re-check reminder rescheduled.',
    };
  },
);

export const sendCustomerEmailAgain = memberAction(
  { permission: 'followup.manage', schema: followUpJobSchema },
  async ({ jobId }, member) => {
    const followUp = await resendReportEmail(member, jobId);
    refresh(jobId);
    const failed = followUp.customerEmail?.status === 'failed';
    return {
      followUp,
      message: failed
        ? `The e-mail could not be queued (${followUp.customerEmail?.lastError ?? 'no reason given'}); try again shortly.`
        : 'The customer e-mail is on its way again.',
    };
  },
);

'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { memberAction } from '@/server/action';
import { clearSchema, verificationSchema, wrenchIdField, wrenchSchema } from '../schemas';
import { clearWrench, createWrench, recordVerification, updateWrench } from '../server/wrenches';

function refresh(wrenchId?: string) {
  revalidatePath('/tool-crib');
  if (wrenchId) revalidatePath(`/tool-crib/${wrenchId}`);
}

export const addWrench = memberAction(
  { permission: 'wrenches.manage', schema: wrenchSchema },
  async (input, member) => {
    const wrench = await createWrench(member, input);
    refresh();
    redirect(`/tool-crib/${wrench.id}`);
  },
);

export const editWrench = memberAction(
  { permission: 'wrenches.manage', schema: wrenchSchema.extend({ wrenchId: wrenchIdField }) },
  async ({ wrenchId, ...input }, member) => {
    const wrench = await updateWrench(member, wrenchId, input);
    refresh(wrenchId);
    return wrench;
  },
);

export const verifyWrench = memberAction(
  {
    permission: 'verifications.record',
    schema: verificationSchema.extend({ wrenchId: wrenchIdField }),
  },
  async ({ wrenchId, ...input }, member) => {
    const result = await recordVerification(member, wrenchId, input);
    refresh(wrenchId);
    return result;
  },
);

export const putBackInService = memberAction(
  { permission: 'wrenches.clear', schema: clearSchema.extend({ wrenchId: wrenchIdField }) },
  async ({ wrenchId, reason }, member) => {
    const wrench = await clearWrench(member, wrenchId, reason);
    refresh(wrenchId);
    return wrench;
  },
);

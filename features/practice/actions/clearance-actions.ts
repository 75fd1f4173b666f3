'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { clearApprenticeSchema, revokeClearanceSchema } from '../clearance-schemas';
import { clearApprentice, revokeClearance } from '../server/clearances';

export const clearForRealWheels = memberAction(
  { permission: 'practice.clear', schema: clearApprenticeSchema },
  async (input, lead) => {
    const cleared = await clearApprentice(lead, input);
    revalidatePath('/practice/progress');
    revalidatePath('/team');
    return cleared;
  },
);

export const revokeRealWheelsClearance = memberAction(
  { permission: 'practice.clear', schema: revokeClearanceSchema },
  async (input, lead) => {
    const revoked = await revokeClearance(lead, input.userId);
    revalidatePath('/practice/progress');
    revalidatePath('/team');
    return revoked;
  },
);

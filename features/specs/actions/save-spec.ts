'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { z } from 'zod';
import { memberAction } from '@/server/action';
import { specIdField, specSchema } from '../schemas';
import { createSpec, updateSpec } from '../server/specs';

export const createWheelSpec = memberAction(
  { permission: 'specs.manage', schema: specSchema },
  async (input, member) => {
    const spec = await createSpec(member, input);
    revalidatePath('/specs');
    redirect(`/specs/${spec.id}?saved=1`);
  },
);

export const updateWheelSpec = memberAction(
  {
    permission: 'specs.manage',
    schema: z.intersection(specSchema, z.object({ specId: specIdField })),
  },
  async ({ specId, ...input }, member) => {
    const spec = await updateSpec(member, specId, input);
    revalidatePath('/specs');
    revalidatePath(`/specs/${specId}`);
    return spec;
  },
);

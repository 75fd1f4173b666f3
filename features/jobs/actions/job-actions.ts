'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { memberAction } from '@/server/action';
import { ids, jobSchema, jobUpdateSchema, transitionSchema } from '../schemas';
import { createJob, updateJob } from '../server/jobs';
import { transitionJob } from '../server/transitions';

export const createJobCard = memberAction(
  { permission: 'jobs.create', schema: jobSchema },
  async (input, member) => {
    const job = await createJob(member, input);
    revalidatePath('/board');
    redirect(`/jobs/${job.id}`);
  },
);

export const updateJobCard = memberAction(
  { permission: 'jobs.edit', schema: jobUpdateSchema.extend({ jobId: ids.job }) },
  async ({ jobId, ...patch }, member) => {
    const job = await updateJob(member, jobId, patch);
    revalidatePath(`/jobs/${jobId}`);
    return job;
  },
);

/** Start, submit, sign off or send back; who may is decided per job in the server layer. */
export const moveJobCard = memberAction(
  { permission: 'board.view', schema: transitionSchema.extend({ jobId: ids.job }) },
  async ({ jobId, action, note, wheels }, member) => {
    const job = await transitionJob(member, jobId, action, note, { wheels });
    revalidatePath(`/jobs/${jobId}`);
    return job;
  },
);

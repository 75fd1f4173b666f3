import { z } from 'zod';
import { ids } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { submitWheel } from '@/features/runner/server/run';
import { DomainError } from '@/server/errors';
import { apiRoute } from '@/server/http/handler';

/** Submits one wheel; the last wheel in sends the job card to sign-off. */
export const POST = apiRoute(
  { permission: 'jobs.run', params: z.object({ wheelId: ids.wheel }) },
  async ({ member, params }) => {
    const result = await submitWheel(member, params.wheelId);
    // Another device may have sent the job to sign-off a moment ago: that is the outcome we want.
    const job = result.allSubmitted
      ? await transitionJob(
          member,
          result.jobId,
          'submit',
          'All wheels submitted from the runner.',
        ).catch((error: unknown) => {
          if (error instanceof DomainError && error.code === 'conflict') return null;
          throw error;
        })
      : null;
    return { data: { ...result, jobState: job?.state ?? null } };
  },
);

import { z } from 'zod';
import { ids } from '@/features/jobs/schemas';
import { getJobReview } from '@/features/review/server/review-data';
import { apiRoute } from '@/server/http/handler';
import { reviewSources } from '@/app/_review/sources';

const params = z.object({ jobId: ids.job });

/** A job card's record as a lead reviews it: anomalies first, then each wheel's passes, photos and steps. */
export const GET = apiRoute({ permission: 'jobs.signoff', params }, async ({ member, params }) => ({
  data: await getJobReview(member.shopId, params.jobId, reviewSources),
}));

import { z } from 'zod';
import { getSignoffQueue } from '@/features/review/server/signoff-queue';
import { apiRoute } from '@/server/http/handler';
import { reviewSources } from '@/app/_review/sources';

const query = z.object({
  only: z.enum(['count'], { error: 'Use only=count, or leave it out.' }).optional(),
});

/** The shop's job cards awaiting sign-off, oldest first, with anomaly counts: for leads. `?only=count`: the number alone (the nav polls it). */
export const GET = apiRoute({ permission: 'jobs.signoff', query }, async ({ member, query }) => ({
  data: await getSignoffQueue(member.shopId, reviewSources, { countOnly: query.only === 'count' }),
}));

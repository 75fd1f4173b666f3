import { getSignoffQueue } from '@/features/review/server/signoff-queue';
import { apiRoute } from '@/server/http/handler';
import { reviewSources } from '@/app/_review/sources';

/** The shop's job cards awaiting sign-off, oldest first, with anomaly counts: for leads (the nav polls it). */
export const GET = apiRoute({ permission: 'jobs.signoff' }, async ({ member }) => ({ data: await getSignoffQueue(member.shopId, reviewSources) }));

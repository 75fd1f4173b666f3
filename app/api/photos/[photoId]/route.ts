import { z } from 'zod';
import { streamPhoto } from '@/features/runner/server/photo-file';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ photoId: z.uuid() });

/** A wheel photo, for people who may see the shop's job cards (thumbnails, the runner's summary). */
export const GET = apiRoute({ permission: 'jobs.view', params }, ({ member, params }) =>
  streamPhoto(member.shopId, params.photoId),
);

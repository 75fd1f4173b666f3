import { z } from 'zod';
import { streamPhoto } from '@/features/runner/server/photo-file';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ photoId: z.uuid() });

/**
 * A wheel photo: for people who may see the shop's job cards (thumbnails, the review), and for
 * the person running the photo's wheel (a cleared apprentice's runner). The guard only requires
 * a member of the shop; streamPhoto decides per photo, so neither group is held to the other's rule.
 */
export const GET = apiRoute({ permission: 'board.view', params }, ({ request, member, params }) =>
  streamPhoto(member, params.photoId, request.signal),
);

import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobs, wheelPhotos } from '@/db/schema';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { notFound } from '@/server/errors';
import { openStoredFile } from '@/server/storage/read-file';
import { storeConfig } from '@/server/storage/store-config';
import { assertMayRun } from './run';

/**
 * One stored photo of this shop, streamed from the upload service through a signed URL that
 * lives a minute: the file itself is private there, so only this route (which has checked the
 * session and the shop) can read it. Another shop's photo id is simply not found. The transfer
 * ends with the request (`signal`) or a stalled store (server/storage/read-file.ts); a
 * misconfigured store throws (the route logs it and answers 500).
 *
 * Whoever may see the shop's job cards sees every photo; anyone else only the photos of a wheel
 * they may run (a cleared apprentice's own wheels), by the runner's own rule, so its thumbnails
 * load for the person at the cart and no further.
 */
export async function streamPhoto(
  member: Member,
  photoId: string,
  signal?: AbortSignal,
): Promise<Response> {
  const config = storeConfig();
  const [row] = await getDb()
    .select({ fileKey: wheelPhotos.fileKey, mime: wheelPhotos.mime, assigneeId: jobs.assigneeId })
    .from(wheelPhotos)
    .innerJoin(jobs, and(eq(jobs.id, wheelPhotos.jobId), eq(jobs.shopId, wheelPhotos.shopId)))
    .where(and(eq(wheelPhotos.shopId, member.shopId), eq(wheelPhotos.id, photoId)));
  if (!row) throw notFound('That photo');
  if (!can(member, 'jobs.view')) assertMayRun(member, { job: row });
  const file = await openStoredFile(config, row.fileKey, { signal });
  if (!file) {
    return Response.json(
      {
        error: {
          code: 'unavailable',
          message: 'The photo store did not answer; try again in a moment.',
        },
      },
      { status: 502 },
    );
  }
  return new Response(file.body, {
    headers: {
      ...(file.length === null ? {} : { 'content-length': String(file.length) }),
      'content-type': row.mime,
      'content-disposition': 'inline',
      'cache-control': 'private, max-age=300',
      'x-content-type-options': 'nosniff',
    },
  });
}

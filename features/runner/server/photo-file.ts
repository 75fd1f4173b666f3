import 'server-only';
import { and, eq } from 'drizzle-orm';
import { UTApi } from 'uploadthing/server';
import { getDb } from '@/db';
import { jobs, wheelPhotos } from '@/db/schema';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { notFound } from '@/server/errors';
import { assertMayRun } from './run';

/**
 * One stored photo of this shop, streamed from the upload service through a signed URL that
 * lives a minute: the file itself is private there, so only this route (which has checked the
 * session and the shop) can read it. Another shop's photo id is simply not found.
 *
 * Whoever may see the shop's job cards sees every photo; anyone else only the photos of a wheel
 * they may run (a cleared apprentice's own wheels), by the runner's own rule, so its thumbnails
 * load for the person at the cart and no further.
 */
export async function streamPhoto(member: Member, photoId: string): Promise<Response> {
  const [row] = await getDb()
    .select({ fileKey: wheelPhotos.fileKey, mime: wheelPhotos.mime, assigneeId: jobs.assigneeId })
    .from(wheelPhotos)
    .innerJoin(jobs, and(eq(jobs.id, wheelPhotos.jobId), eq(jobs.shopId, wheelPhotos.shopId)))
    .where(and(eq(wheelPhotos.shopId, member.shopId), eq(wheelPhotos.id, photoId)));
  if (!row) throw notFound('That photo');
  if (!can(member, 'jobs.view')) assertMayRun(member, { job: row });
  const { ufsUrl } = await new UTApi().generateSignedURL(row.fileKey, { expiresIn: 60 });
  const res = await fetch(ufsUrl).catch(() => null);
  if (!res?.ok || !res.body) {
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
  return new Response(res.body, {
    headers: {
      'content-type': row.mime,
      'content-disposition': 'inline',
      'cache-control': 'private, max-age=300',
      'x-content-type-options': 'nosniff',
    },
  });
}

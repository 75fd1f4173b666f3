import 'server-only';
import { and, eq } from 'drizzle-orm';
import { UTApi } from 'uploadthing/server';
import { getDb } from '@/db';
import { wheelPhotos } from '@/db/schema';
import { notFound } from '@/server/errors';

/**
 * One stored photo of this shop, streamed from the upload service through a signed URL that
 * lives a minute: the file itself is private there, so only this route (which has checked the
 * session and the shop) can read it. Another shop's photo id is simply not found.
 */
export async function streamPhoto(shopId: string, photoId: string): Promise<Response> {
  const [row] = await getDb()
    .select({ fileKey: wheelPhotos.fileKey, mime: wheelPhotos.mime })
    .from(wheelPhotos)
    .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.id, photoId)));
  if (!row) throw notFound('That photo');
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

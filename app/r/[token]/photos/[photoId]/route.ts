import { publicPhotoParams } from '@/features/reports/schemas';
import { getPublicPhoto } from '@/features/reports/server/public-report';
import { publicNotFound } from '@/features/reports/server/public-response';

/**
 * A photo of the link's own job, its bytes streamed from the private store until the customer
 * leaves. A misconfigured store throws: Next logs it and answers 500.
 */
export async function GET(
  request: Request,
  { params }: RouteContext<'/r/[token]/photos/[photoId]'>,
) {
  const parsed = publicPhotoParams.safeParse(await params);
  const photo = parsed.success
    ? await getPublicPhoto(parsed.data.token, parsed.data.photoId, request.signal)
    : null;
  if (!photo) return publicNotFound();
  return new Response(photo.body, {
    headers: {
      ...(photo.length === null ? {} : { 'content-length': String(photo.length) }),
      'content-type': photo.mime,
      'content-disposition': 'inline',
      'cache-control': 'private, max-age=300',
      'x-content-type-options': 'nosniff',
      'x-robots-tag': 'noindex, nofollow',
      'referrer-policy': 'no-referrer',
    },
  });
}

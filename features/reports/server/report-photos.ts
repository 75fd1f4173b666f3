import 'server-only';
import { and, eq, inArray } from 'drizzle-orm';
import type SharpFn from 'sharp';
import { UTApi } from 'uploadthing/server';
import { getDb } from '@/db';
import { wheelPhotos } from '@/db/schema';
import type { PhotoImage } from '../pdf/wheel-section';

/** Photos in the PDF are at most this wide: enough to see the bead and ring gap, small enough to mail. */
const MAX_EDGE = 640;
/** Without an image library, a stored JPEG or PNG up to this size goes in as it is. */
const MAX_RAW_BYTES = 1_500_000;
const FETCH_TIMEOUT_MS = 8_000;

/** The bytes of one of this shop's photos, from the private store through a short-lived signed URL. */
export async function readPhotoBytes(
  shopId: string,
  jobId: string,
  photoId: string,
): Promise<{ bytes: Buffer; mime: string } | null> {
  const [row] = await getDb()
    .select({ fileKey: wheelPhotos.fileKey, mime: wheelPhotos.mime })
    .from(wheelPhotos)
    .where(
      and(
        eq(wheelPhotos.shopId, shopId),
        eq(wheelPhotos.jobId, jobId),
        eq(wheelPhotos.id, photoId),
      ),
    );
  if (!row) return null;
  try {
    const { ufsUrl } = await new UTApi().generateSignedURL(row.fileKey, { expiresIn: 60 });
    const res = await fetch(ufsUrl, { signal: AbortSignal.timeout(FETCH_TIMEOUT_MS) });
    if (!res.ok) return null;
    return { bytes: Buffer.from(await res.arrayBuffer()), mime: row.mime };
  } catch {
    return null;
  }
}

let sharpModule: Promise<typeof SharpFn | null> | undefined;
/** The image library Next ships (optional): without it, photos go in as stored when small enough. */
const loadSharp = () =>
  (sharpModule ??= import('sharp').then(
    (m) => m.default,
    () => null,
  ));

async function downscale(bytes: Buffer, mime: string): Promise<PhotoImage | null> {
  const sharp = await loadSharp();
  if (!sharp) {
    if (bytes.byteLength > MAX_RAW_BYTES) return null;
    if (mime === 'image/jpeg') return { data: bytes, format: 'jpg' };
    if (mime === 'image/png') return { data: bytes, format: 'png' };
    return null;
  }
  try {
    const data = await sharp(bytes)
      .rotate()
      .resize({ width: MAX_EDGE, height: MAX_EDGE, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 72 })
      .toBuffer();
    return { data, format: 'jpg' };
  } catch {
    // Bytes that do not decode: left out (the PDF says so) rather than breaking the whole report.
    return null;
  }
}

/** Every photo of the job, downscaled for the PDF; one that cannot be read is null (the PDF says so). */
export async function loadReportImages(
  shopId: string,
  jobId: string,
  photoIds: string[],
): Promise<Record<string, PhotoImage | null>> {
  if (!photoIds.length) return {};
  const rows = await getDb()
    .select({ id: wheelPhotos.id })
    .from(wheelPhotos)
    .where(
      and(
        eq(wheelPhotos.shopId, shopId),
        eq(wheelPhotos.jobId, jobId),
        inArray(wheelPhotos.id, photoIds),
      ),
    );
  const out: Record<string, PhotoImage | null> = {};
  // One at a time: a job's photos are few, and the 2-core server keeps its memory for requests.
  for (const { id } of rows) {
    const file = await readPhotoBytes(shopId, jobId, id);
    out[id] = file ? await downscale(file.bytes, file.mime) : null;
  }
  return out;
}

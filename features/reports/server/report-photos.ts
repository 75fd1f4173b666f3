import 'server-only';
import { and, eq, inArray } from 'drizzle-orm';
import type SharpFn from 'sharp';
import { getDb } from '@/db';
import { wheelPhotos } from '@/db/schema';
import type { PhotoImage } from '../pdf/wheel-section';
import { openStoredFile, readStoredFile } from '@/server/storage/read-file';
import { storeConfig } from '@/server/storage/store-config';

/** Photos in the PDF are at most this wide: enough to see the bead and ring gap, small enough to mail. */
const MAX_EDGE = 640;
/** Without an image library, a stored JPEG or PNG up to this size goes in as it is. */
const MAX_RAW_BYTES = 1_500_000;
type StoredPhoto = { id: string; fileKey: string; mime: string };

/**
 * One of this shop's photos as the store sends it, streamed: the customer's page shows originals
 * of a few MB each, and the server holds none of them whole. The transfer ends with the request
 * (`signal`) or a store that stalls; a misconfigured store throws (the route answers 500 and
 * logs it) instead of passing for a missing photo.
 */
export async function openPhoto(
  shopId: string,
  jobId: string,
  photoId: string,
  signal?: AbortSignal,
): Promise<{ body: ReadableStream<Uint8Array>; mime: string; length: number | null } | null> {
  const config = storeConfig();
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
  const file = await openStoredFile(config, row.fileKey, { signal });
  return file && { ...file, mime: row.mime };
}

let sharpModule: Promise<typeof SharpFn | null> | undefined;
/**
 * The image library Next ships (optional): without it, photos go in as stored when small enough.
 * Its operation cache is off: each photo is decoded once, so the cache only held memory.
 */
const loadSharp = () =>
  (sharpModule ??= import('sharp').then(
    (m) => {
      m.default.cache(false);
      return m.default;
    },
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
    // Shrink-on-load decodes a phone's JPEG at an eighth or a quarter of its size: the full
    // 12 MP picture is never held in memory.
    const data = await sharp(bytes)
      .rotate()
      .resize({
        width: MAX_EDGE,
        height: MAX_EDGE,
        fit: 'inside',
        withoutEnlargement: true,
        fastShrinkOnLoad: true,
      })
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
  // Read before any photo: a misconfigured store fails the build (and the queue's job, with this
  // reason) instead of sending the customer a report whose every photo "could not be read".
  const config = storeConfig();
  const rows: StoredPhoto[] = await getDb()
    .select({ id: wheelPhotos.id, fileKey: wheelPhotos.fileKey, mime: wheelPhotos.mime })
    .from(wheelPhotos)
    .where(
      and(
        eq(wheelPhotos.shopId, shopId),
        eq(wheelPhotos.jobId, jobId),
        inArray(wheelPhotos.id, photoIds),
      ),
    );
  const out: Record<string, PhotoImage | null> = {};
  // One photo at a time, fetched then decoded. Side by side, each decode takes a thread of the
  // image library (and with it a C allocator arena the process keeps) and each fetch holds its
  // body twice while undici joins it: three at once peaked 20–30 MB higher in bench:report for
  // the same CPU. The cost is wall time against a remote store: its round trips add up.
  for (const { id, fileKey, mime } of rows) {
    const bytes = await readStoredFile(config, fileKey);
    out[id] = bytes ? await downscale(bytes, mime) : null;
  }
  return out;
}

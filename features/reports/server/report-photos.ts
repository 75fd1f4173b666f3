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
/**
 * Photos fetched and downscaled at once: the fetch of one overlaps the decoding of another, and
 * a 12-megapixel phone picture shrunk on load needs only a few MB, so three stay well inside the
 * server's memory on 2 cores.
 */
const CONCURRENCY = 3;

type StoredPhoto = { id: string; fileKey: string; mime: string };

/** The bytes of a stored file, through a short-lived signed URL of the private store. */
async function fetchStored(fileKey: string): Promise<Buffer | null> {
  try {
    const { ufsUrl } = await new UTApi().generateSignedURL(fileKey, { expiresIn: 60 });
    const res = await fetch(ufsUrl, { signal: AbortSignal.timeout(FETCH_TIMEOUT_MS) });
    if (!res.ok) return null;
    return Buffer.from(await res.arrayBuffer());
  } catch {
    return null;
  }
}

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
  const bytes = await fetchStored(row.fileKey);
  return bytes ? { bytes, mime: row.mime } : null;
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

/** Runs `work` over `items`, at most `limit` at a time. */
async function eachLimited<T>(items: T[], limit: number, work: (item: T) => Promise<void>) {
  let next = 0;
  const worker = async () => {
    while (next < items.length) await work(items[next++]!);
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, worker));
}

/** Every photo of the job, downscaled for the PDF; one that cannot be read is null (the PDF says so). */
export async function loadReportImages(
  shopId: string,
  jobId: string,
  photoIds: string[],
): Promise<Record<string, PhotoImage | null>> {
  if (!photoIds.length) return {};
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
  await eachLimited(rows, CONCURRENCY, async ({ id, fileKey, mime }) => {
    const bytes = await fetchStored(fileKey);
    out[id] = bytes ? await downscale(bytes, mime) : null;
  });
  return out;
}

import 'server-only';
import { fileTypeFromBuffer } from 'file-type';

export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
const IMAGE_TYPES = new Set(['image/jpeg', 'image/png', 'image/webp']);
/** Enough of the file's start to tell its type by content. */
const SNIFF_BYTES = 64 * 1024;

/**
 * What the upload service does not check: that the bytes really are a photo (by their content,
 * not the name or the declared type) and not over 10 MB.
 */
export async function inspectPhoto(
  bytes: Uint8Array,
): Promise<{ ok: true; mime: string } | { ok: false; message: string }> {
  if (bytes.byteLength > MAX_PHOTO_BYTES)
    return {
      ok: false,
      message: `The photo is ${(bytes.byteLength / 1048576).toFixed(1)} MB; at most 10 MB.`,
    };
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !IMAGE_TYPES.has(type.mime))
    return { ok: false, message: 'That file is not a JPEG, PNG or WebP photo.' };
  return { ok: true, mime: type.mime };
}

/**
 * The same judgement read from a stream: it keeps only the first bytes (for the type), counts the
 * rest, and stops reading as soon as the file passes the limit, so a huge file never sits in memory.
 */
export async function inspectPhotoStream(
  stream: ReadableStream<Uint8Array>,
  limit = MAX_PHOTO_BYTES,
): Promise<{ ok: true; mime: string; bytes: number } | { ok: false; message: string }> {
  const reader = stream.getReader();
  const head = new Uint8Array(SNIFF_BYTES);
  let headLength = 0;
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel();
      return {
        ok: false,
        message: `The photo is over ${limit / 1048576} MB; at most ${limit / 1048576} MB.`,
      };
    }
    if (headLength < SNIFF_BYTES) {
      const take = value.subarray(0, SNIFF_BYTES - headLength);
      head.set(take, headLength);
      headLength += take.byteLength;
    }
  }
  const verdict = await inspectPhoto(head.subarray(0, headLength));
  return verdict.ok ? { ...verdict, bytes: total } : verdict;
}

import 'server-only';
import { fileTypeFromBuffer } from 'file-type';

export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
const IMAGE_TYPES = new Set(['image/jpeg', 'image/png', 'image/webp']);

/**
 * What the upload service does not check: that the bytes really are a photo (by their content,
 * not the name or the declared type) and not over 10 MB.
 */
export async function inspectPhoto(bytes: Uint8Array): Promise<{ ok: true; mime: string } | { ok: false; message: string }> {
  if (bytes.byteLength > MAX_PHOTO_BYTES) return { ok: false, message: `The photo is ${(bytes.byteLength / 1048576).toFixed(1)} MB; at most 10 MB.` };
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !IMAGE_TYPES.has(type.mime)) return { ok: false, message: 'That file is not a JPEG, PNG or WebP photo.' };
  return { ok: true, mime: type.mime };
}

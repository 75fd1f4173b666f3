import 'server-only';

/**
 * The largest JSON body the API reads: a job card with its wheels is a few kB, so 256 kB leaves
 * room and keeps a flood of bytes from being buffered. Server actions have the same cap in
 * next.config.mjs (experimental.serverActions.bodySizeLimit).
 */
export const MAX_JSON_BODY_BYTES = 256 * 1024;

/** The body was larger than the cap: answered 413 with code `too_large`. */
export class BodyTooLarge extends Error {
  constructor(readonly limit: number) {
    super(`The request body is larger than ${Math.round(limit / 1024)} kB.`);
    this.name = 'BodyTooLarge';
  }
}

/**
 * Reads the body as text, refusing it as soon as it passes `limit` bytes: by its declared
 * Content-Length before reading anything, else while it streams (chunked bodies declare none).
 */
export async function readLimitedText(
  request: Request,
  limit = MAX_JSON_BODY_BYTES,
): Promise<string> {
  const declared = Number(request.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > limit) throw new BodyTooLarge(limit);
  if (!request.body) return '';
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => {});
      throw new BodyTooLarge(limit);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

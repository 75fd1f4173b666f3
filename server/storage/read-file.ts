import 'server-only';
import { signedFileUrl } from './signed-url';
import type { StoreConfig } from './store-config';

/** How long the store may take to answer (its status and headers). */
const ANSWER_MS = 8_000;
/** How long a streamed file may go without a chunk before it is given up. */
const IDLE_MS = 15_000;
/** Signed URLs live a minute: long enough for one read, short enough to be useless if leaked. */
const URL_TTL_SECONDS = 60;

type ReadOptions = { signal?: AbortSignal; answerMs?: number; idleMs?: number };
export type StoredStream = { body: ReadableStream<Uint8Array>; length: number | null };

/**
 * A private file's bytes, whole (the image library gathers its input into one buffer anyway), or
 * null when the store does not have it or does not send all of it within `timeoutMs`. The config
 * is the caller's, read before this: a misconfigured store throws there, not here.
 */
export async function readStoredFile(
  config: StoreConfig,
  fileKey: string,
  { timeoutMs = ANSWER_MS }: { timeoutMs?: number } = {},
): Promise<Buffer | null> {
  const url = await signedFileUrl(config, fileKey, URL_TTL_SECONDS);
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(timeoutMs) });
    if (!res.ok) {
      // Unread, the answer's body would hold its connection until undici's body timeout.
      await res.body?.cancel();
      return null;
    }
    return Buffer.from(await res.arrayBuffer());
  } catch {
    return null;
  }
}

/**
 * A private file as the store sends it, streamed, or null when the store does not have it or does
 * not answer within `answerMs`. The transfer ends with `signal` (the reader left) or after
 * `idleMs` without a chunk (a stalled store), so no request waits on the store for minutes.
 */
export async function openStoredFile(
  config: StoreConfig,
  fileKey: string,
  { signal, answerMs = ANSWER_MS, idleMs = IDLE_MS }: ReadOptions = {},
): Promise<StoredStream | null> {
  const url = await signedFileUrl(config, fileKey, URL_TTL_SECONDS);
  const ours = new AbortController();
  const answerTimer = setTimeout(() => ours.abort(new Error('the store did not answer')), answerMs);
  try {
    const res = await fetch(url, {
      signal: signal ? AbortSignal.any([signal, ours.signal]) : ours.signal,
    });
    if (!res.ok || !res.body) {
      await res.body?.cancel();
      return null;
    }
    // fetch undoes a content-encoding (gzip…) but keeps the encoded length: passed on, it would
    // cut the decoded bytes short. The length is the file's only when nothing was decoded.
    const length = res.headers.has('content-encoding') ? null : res.headers.get('content-length');
    return {
      body: idleLimited(res.body, idleMs, ours),
      length: length && /^\d+$/.test(length) ? Number(length) : null,
    };
  } catch {
    return null;
  } finally {
    clearTimeout(answerTimer);
  }
}

/** `source` passed on chunk by chunk; a wait of more than `idleMs` for one fails the stream. */
function idleLimited(
  source: ReadableStream<Uint8Array>,
  idleMs: number,
  fetchAbort: AbortController,
): ReadableStream<Uint8Array> {
  const reader = source.getReader();
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      let timer: NodeJS.Timeout | undefined;
      const stalled = new Promise<never>((_, fail) => {
        timer = setTimeout(
          () => fail(new Error(`the store sent nothing for ${idleMs} ms`)),
          idleMs,
        );
      });
      try {
        const next = await Promise.race([reader.read(), stalled]);
        if (next.done) controller.close();
        else controller.enqueue(next.value);
      } catch (error) {
        // Errored rather than closed: the reader must not take a cut-off file for a whole one.
        fetchAbort.abort(error);
        controller.error(error);
      } finally {
        clearTimeout(timer);
      }
    },
    cancel(reason) {
      fetchAbort.abort(reason);
      return reader.cancel(reason);
    },
  });
}

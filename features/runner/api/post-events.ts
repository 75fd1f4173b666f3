import type { FailureCode } from '@/server/action';
import type { SaveEvents } from './send-outcome';

type SaveAnswer = Awaited<ReturnType<SaveEvents>>;
type Body = {
  data?: Extract<SaveAnswer, { ok: true }>['data'];
  error?: { code?: unknown; message?: unknown; fields?: Record<string, string[]> };
};

// The JSON API's error codes the outbox acts on; `satisfies` fails the build when a code is added.
const FAILURE_CODES = {
  invalid: true,
  unauthenticated: true,
  forbidden: true,
  not_found: true,
  conflict: true,
  rate_limited: true,
  internal: true,
} satisfies Record<FailureCode, true>;
const isFailureCode = (code: unknown): code is FailureCode =>
  typeof code === 'string' && Object.hasOwn(FAILURE_CODES, code);

/**
 * The save handler's answer as the outbox reads it: `{ data }` is saved (with any per-event
 * refusals), `{ error: { code, message, fields } }` a whole-batch failure with its code. Anything
 * else (a body over the API's cap, a proxy's error page, no JSON) throws, so the send is retried
 * with the events kept, as when the network drops.
 */
export async function readSaveAnswer(res: Response): Promise<SaveAnswer> {
  const body = (await res.json().catch(() => null)) as Body | null;
  if (res.ok && body?.data) return { ok: true, data: body.data };
  const error = body?.error;
  if (!res.ok && error && isFailureCode(error.code) && typeof error.message === 'string') {
    return {
      ok: false,
      code: error.code,
      message: error.message,
      ...(error.fields ? { fieldErrors: error.fields } : {}),
    };
  }
  throw new Error(`The save answered ${res.status} without a result.`);
}

/**
 * How a real wheel's outbox sends: `POST /api/wheels/:id/events` (a stable address that survives
 * deploys, unlike a server action's id). The browser adds the session cookie and the Origin the
 * handler checks.
 */
export const postWheelEvents: SaveEvents = async (_prev, { wheelId, events }) =>
  readSaveAnswer(
    await fetch(`/api/wheels/${encodeURIComponent(wheelId)}/events`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ events }),
    }),
  );

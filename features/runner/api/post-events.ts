import type { FailureCode } from '@/server/action';
import type { EventRefusal } from '../events';
import { KeptForRetry, type SaveEvents } from './send-outcome';

type SaveAnswer = Awaited<ReturnType<SaveEvents>>;
type Saved = Extract<SaveAnswer, { ok: true }>['data'];

// The JSON API's error codes the outbox acts on; `satisfies` fails the build when a code is added.
const FAILURE_CODES = {
  invalid: true,
  unauthenticated: true,
  forbidden: true,
  cross_origin: true,
  not_found: true,
  conflict: true,
  rate_limited: true,
  internal: true,
} satisfies Record<FailureCode, true>;
const isFailureCode = (code: unknown): code is FailureCode =>
  typeof code === 'string' && Object.hasOwn(FAILURE_CODES, code);

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);
const isCount = (value: unknown): value is number =>
  typeof value === 'number' && Number.isSafeInteger(value) && value >= 0;
const isFieldErrors = (value: unknown): value is Record<string, string[]> =>
  isRecord(value) &&
  Object.values(value).every((v) => Array.isArray(v) && v.every((m) => typeof m === 'string'));
const isRefusal = (value: unknown): value is EventRefusal =>
  isRecord(value) &&
  isCount(value.index) &&
  (value.clientId === null || typeof value.clientId === 'string') &&
  typeof value.message === 'string' &&
  isFieldErrors(value.fieldErrors);

/**
 * The saved result, only in the handler's exact shape and only when it accounts for the whole
 * batch (each event saved, a duplicate or refused at its own index). Anything 200 with some
 * `data` is not enough: a captive portal or a proxy could answer that, and the outbox drops what
 * it takes as saved.
 */
function savedFrom(data: unknown, sent: number): Saved | null {
  if (!isRecord(data) || !isCount(data.saved) || !isCount(data.duplicates)) return null;
  const refused = data.refused ?? [];
  if (!Array.isArray(refused) || !refused.every(isRefusal)) return null;
  if (data.saved + data.duplicates + refused.length !== sent) return null;
  if (!refused.every((r) => r.index < sent)) return null;
  if (data.refused === undefined) return { saved: data.saved, duplicates: data.duplicates };
  return { saved: data.saved, duplicates: data.duplicates, refused };
}

/**
 * The save handler's answer to a batch of `sent` events as the outbox reads it: `{ data }` is saved (with any per-event
 * refusals), `{ error: { code, message, fields } }` a whole-batch failure with its code. A refused
 * Origin (`cross_origin`: a proxy or an address the app does not know rewrote it) says nothing
 * about the events, so it throws KeptForRetry with its message. Anything else (a body over the
 * API's cap, a proxy's error page, no JSON, a result of another shape) throws, so the send is
 * retried with the events kept, as when the network drops.
 */
export async function readSaveAnswer(res: Response, sent: number): Promise<SaveAnswer> {
  const body: unknown = await res.json().catch(() => null);
  if (res.ok && isRecord(body)) {
    const data = savedFrom(body.data, sent);
    if (data) return { ok: true, data };
  }
  const error = isRecord(body) && isRecord(body.error) ? body.error : null;
  if (!res.ok && error && typeof error.message === 'string') {
    if (error.code === ('cross_origin' satisfies FailureCode))
      throw new KeptForRetry(error.message, false);
    if (isFailureCode(error.code)) {
      return {
        ok: false,
        code: error.code,
        message: error.message,
        ...(isFieldErrors(error.fields) ? { fieldErrors: error.fields } : {}),
      };
    }
  }
  throw new Error(`The save answered ${res.status} without a result.`);
}

/**
 * An outbox's save: POSTs `{ events }` as JSON to the address for its id (a stable address that
 * survives deploys, unlike a server action's id) and reads the answer with `readSaveAnswer`. The
 * browser adds the session cookie and the Origin the handler checks.
 */
export const eventsPoster =
  (address: (id: string) => string): SaveEvents =>
  async (_prev, { wheelId, events }) =>
    readSaveAnswer(
      await fetch(address(encodeURIComponent(wheelId)), {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ events }),
      }),
      events.length,
    );

/** How a real wheel's outbox sends: `POST /api/wheels/:id/events`. */
export const postWheelEvents = eventsPoster((id) => `/api/wheels/${id}/events`);

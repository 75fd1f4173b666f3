import { POST } from '@/app/api/wheels/[wheelId]/events/route';
import { readSaveAnswer } from '@/features/runner/api/post-events';
import type { SaveEvents } from '@/features/runner/api/send-outcome';
import { sessionCookieName } from '@/server/auth/session';
import { apiRequest, params } from './factories';
import { cookieValue } from './next-request';

/**
 * The runner's save as a real wheel's phone sends it: `POST /api/wheels/:id/events` from the
 * app's origin, signed in as the in-memory request's person (`actAs`; signed out after
 * `resetNextRequest`), its answer read by the outbox's own reader (`readSaveAnswer`).
 */
export async function postToWheelEvents(
  _prev: unknown,
  { wheelId, events }: { wheelId: string; events: unknown[] },
): ReturnType<SaveEvents> {
  const token = cookieValue(sessionCookieName());
  const res = await POST(
    apiRequest(`/api/wheels/${wheelId}/events`, {
      method: 'POST',
      cookie: token ? `${sessionCookieName()}=${token}` : undefined,
      body: { events },
    }),
    params({ wheelId }),
  );
  return readSaveAnswer(res, events.length);
}

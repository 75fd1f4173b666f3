import 'server-only';
import type { z } from 'zod';
import { fieldErrorsOf } from '@/server/action';
import { requireMemberForRequest, sessionIdForRequest } from '@/server/auth/guard';
import type { Permission } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { env } from '@/server/env.mjs';
import { DomainError, type DomainErrorCode } from '@/server/errors';
import { BodyTooLarge, readLimitedText } from './body-limit';

/** The one error shape of the JSON API. */
export type ApiError = {
  error: { code: string; message: string; fields?: Record<string, string[]> };
};

const STATUS: Record<DomainErrorCode, number> = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  cross_origin: 403,
  not_found: 404,
  conflict: 409,
  rate_limited: 429,
};

export function errorResponse(error: DomainError): Response {
  const body: ApiError = { error: { code: error.code, message: error.message } };
  if (error.fields) body.error.fields = error.fields;
  return Response.json(body, { status: STATUS[error.code] });
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Next checks the origin of server actions only. A mutating route handler accepts a request only
 * when its Origin is this app's own (the configured APP_URL or the Host it was sent to).
 */
export function assertSameOrigin(request: Request) {
  if (SAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get('origin');
  const host = request.headers.get('host');
  const allowed = new Set([new URL(env().APP_URL).origin]);
  if (host) {
    const proto =
      request.headers.get('x-forwarded-proto') ?? new URL(request.url).protocol.replace(':', '');
    allowed.add(`${proto}://${host}`);
  }
  if (!origin || !allowed.has(origin)) {
    throw new DomainError(
      'cross_origin',
      'Cross-origin request refused: send it from the Ringpass app (Origin header).',
    );
  }
}

async function readJson(request: Request): Promise<unknown> {
  const text = await readLimitedText(request);
  if (!text) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new DomainError('invalid', 'The request body is not valid JSON.');
  }
}

function validate<S extends z.ZodType>(schema: S, value: unknown, what: string): z.output<S> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  throw new DomainError(
    'invalid',
    `The ${what} has errors; see fields.`,
    fieldErrorsOf(parsed.error),
  );
}

type Context<P, B, Q> = { request: Request; member: Member; params: P; body: B; query: Q };
/**
 * What a quick first try gets: the valid params and body, the cookie's session id (no member yet)
 * and the route's permission, which its statement checks for itself.
 */
type QuickContext<P, B> = { params: P; body: B; sessionId: string; permission: Permission };

/**
 * The one way to write a route handler: origin check for writes, session and role, params
 * (a malformed id is simply not found), query and body through zod, then the feature call.
 * Domain errors map to their status; anything else is a 500 with no detail.
 */
export function apiRoute<
  PS extends z.ZodType = z.ZodType<Record<string, string>>,
  BS extends z.ZodType = z.ZodUnknown,
  QS extends z.ZodType = z.ZodUnknown,
>(
  options: {
    permission: Permission;
    params?: PS;
    body?: BS;
    query?: QS;
    status?: number;
    /**
     * An optional first try for a hot path, after the origin check and before anyone reads the
     * session: a single statement that checks the session, the permission and the rows itself
     * (`liveMemberSql` with the `permission` it is given). Its answer is sent as `run`'s would be; null
     * (or no session cookie, or params or body that do not parse) goes the ordinary way, which
     * answers in the ordinary order (401, 403, 404, 400), so the answers never depend on this try.
     */
    quick?: (ctx: QuickContext<z.output<PS>, z.output<BS>>) => Promise<unknown>;
  },
  run: (ctx: Context<z.output<PS>, z.output<BS>, z.output<QS>>) => Promise<unknown>,
) {
  const answer = (data: unknown) =>
    data instanceof Response
      ? data
      : Response.json(data ?? { ok: true }, { status: options.status ?? 200 });
  return async (
    request: Request,
    context: { params: Promise<Record<string, string | string[]>> },
  ) => {
    // Read once: the quick try and the ordinary way share it (a failure is rethrown where it is awaited).
    let json: Promise<unknown> | undefined;
    const readBody = () => (json ??= readJson(request));
    try {
      assertSameOrigin(request);
      if (options.quick) {
        const data = await tryQuick(options, options.quick, request, context, readBody);
        if (data !== null) return answer(data);
      }
      const member = await requireMemberForRequest(request, options.permission);
      const rawParams = (await context?.params) ?? {};
      let params = rawParams as z.output<PS>;
      if (options.params) {
        const parsed = options.params.safeParse(rawParams);
        if (!parsed.success) throw new DomainError('not_found', 'That record was not found.');
        params = parsed.data;
      }
      const url = new URL(request.url);
      const query = options.query
        ? validate(options.query, Object.fromEntries(url.searchParams), 'query')
        : (undefined as z.output<QS>);
      const body = options.body
        ? validate(options.body, await readBody(), 'body')
        : (undefined as z.output<BS>);
      return answer(await run({ request, member, params, body, query }));
    } catch (error) {
      if (error instanceof DomainError) return errorResponse(error);
      if (error instanceof BodyTooLarge) {
        return Response.json(
          { error: { code: 'too_large', message: error.message } } satisfies ApiError,
          { status: 413 },
        );
      }
      console.error('[api] unexpected failure', error);
      return Response.json(
        {
          error: { code: 'internal', message: 'Something went wrong on our side.' },
        } satisfies ApiError,
        { status: 500 },
      );
    }
  };
}

/** The quick try's answer, or null when it does not apply or stored nothing (the ordinary way answers). */
async function tryQuick<P, B>(
  options: { permission: Permission; params?: z.ZodType; body?: z.ZodType },
  quick: (ctx: QuickContext<P, B>) => Promise<unknown>,
  request: Request,
  context: { params: Promise<Record<string, string | string[]>> },
  readBody: () => Promise<unknown>,
): Promise<unknown> {
  const sessionId = sessionIdForRequest(request);
  if (!sessionId) return null;
  const rawParams = (await context?.params) ?? {};
  const params = options.params
    ? options.params.safeParse(rawParams)
    : { success: true as const, data: rawParams };
  if (!params.success) return null;
  let body: unknown;
  if (options.body) {
    // Too large, not JSON or invalid: the ordinary way refuses it, after the session check.
    const parsed = await readBody().then(
      (raw) => options.body!.safeParse(raw),
      () => null,
    );
    if (!parsed?.success) return null;
    body = parsed.data;
  }
  return quick({
    params: params.data as P,
    body: body as B,
    sessionId,
    permission: options.permission,
  });
}

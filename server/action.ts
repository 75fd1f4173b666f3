import 'server-only';
import { unstable_rethrow } from 'next/navigation';
import type { z } from 'zod';
import { can, type Permission } from '@/server/auth/permissions';
import { getCurrentMember, type Member } from '@/server/auth/session';
import { DomainError, type DomainErrorCode } from '@/server/errors';

export type FieldErrors = Record<string, string[] | undefined>;
export type ActionResult<T> =
  | { ok: true; data: T; message?: string }
  | {
      ok: false;
      code: FailureCode;
      message: string;
      fieldErrors?: FieldErrors;
      values?: Record<string, string>;
    };

/** Why an action failed, for callers that decide what to do next (retry, drop, sign in again). */
export type FailureCode = DomainErrorCode | 'internal';

// Never echoed back into a form after a failed submit.
const SECRET_FIELDS = new Set(['password', 'newPassword', 'currentPassword']);

function formToObject(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of form.entries()) {
    if (key.startsWith('$ACTION')) continue;
    out[key] = typeof value === 'string' ? value : value;
  }
  return out;
}

function echo(raw: Record<string, unknown>): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw)) {
    if (typeof value === 'string' && !SECRET_FIELDS.has(key)) values[key] = value;
  }
  return values;
}

function failure(error: unknown, raw: Record<string, unknown>): ActionResult<never> {
  unstable_rethrow(error); // redirect(), notFound() and friends must reach Next.
  if (error instanceof DomainError) {
    return {
      ok: false,
      code: error.code,
      message: error.message,
      fieldErrors: error.fields,
      values: echo(raw),
    };
  }
  console.error('[action] unexpected failure', error);
  return {
    ok: false,
    code: 'internal',
    message: 'Something went wrong on our side. Nothing was saved; try again.',
    values: echo(raw),
  };
}

/** Messages keyed by the full path of the field ("email", "wheels.0.tireSize"). */
export function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues)
    (fields[issue.path.join('.') || 'form'] ??= []).push(issue.message);
  return fields;
}

async function parseAndRun<S extends z.ZodType, T>(
  schema: S,
  payload: FormData | unknown,
  run: (input: z.output<S>) => Promise<T>,
): Promise<ActionResult<T>> {
  const raw =
    payload instanceof FormData
      ? formToObject(payload)
      : ((payload ?? {}) as Record<string, unknown>);
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    return {
      ok: false,
      code: 'invalid',
      message: 'Check the highlighted fields.',
      fieldErrors: fieldErrorsOf(parsed.error),
      values: echo(raw),
    };
  }
  try {
    return { ok: true, data: await run(parsed.data) };
  } catch (error) {
    return failure(error, raw);
  }
}

/**
 * The one way to write a server action for signed-in members, in this order: session, role
 * permission, zod validation, the data call. Rows are scoped by shop inside `run`.
 * Usable with useActionState (prev, formData) and called directly with an object.
 */
export function memberAction<S extends z.ZodType, T>(
  options: {
    permission: Permission;
    schema: S;
  },
  run: (input: z.output<S>, member: Member) => Promise<T>,
) {
  return async (_prev: unknown, payload: FormData | z.input<S>): Promise<ActionResult<T>> => {
    const member = await getCurrentMember();
    if (!member)
      return {
        ok: false,
        code: 'unauthenticated',
        message: 'Your session has ended. Sign in again.',
      };
    if (!can(member, options.permission)) {
      return { ok: false, code: 'forbidden', message: 'Your role does not allow this.' };
    }
    return parseAndRun(options.schema, payload, (input) => run(input, member));
  };
}

/** For the few actions used signed out (sign-up, sign-in, accepting an invite). */
export function publicAction<S extends z.ZodType, T>(
  schema: S,
  run: (input: z.output<S>) => Promise<T>,
) {
  return async (_prev: unknown, payload: FormData | z.input<S>): Promise<ActionResult<T>> =>
    parseAndRun(schema, payload, run);
}

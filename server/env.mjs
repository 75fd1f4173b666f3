// The one place that reads process.env. Validated once with zod; next.config.mjs imports it
// so a bad configuration stops the build and the server with a readable list.
// (A .mjs file because next.config.mjs loads it without a TypeScript loader; that is also why it
// cannot carry `import 'server-only'`. Nothing in the browser bundle imports it.)
import { z } from 'zod';

const bool = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/** Where this server listens (HOST and PORT, as `npm start` passes them): the default APP_URL. */
function listeningUrl() {
  const host = process.env.HOST?.trim() || '127.0.0.1';
  const shown = ['0.0.0.0', '::', '[::]'].includes(host)
    ? '127.0.0.1'
    : host.includes(':') && !host.startsWith('[')
      ? `[${host}]`
      : host;
  return `http://${shown}:${process.env.PORT?.trim() || '3000'}`;
}

const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// connection URL'),
  APP_URL: z.url().default(() => listeningUrl()),
  SMTP_URL: z.string().regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL'),
  MAIL_FROM: z.string().min(3).default('Ringpass <no-reply@ringpass.test>'),
  MAILBOX_DIR: z.string().min(1).optional(),
  // The Mailbox on a production server only for a demo (npm start sets it); it then shows a banner.
  MAILBOX_DEMO: bool.optional(),
  // Read by the upload SDK itself; here only so the Content-Security-Policy allows the upload
  // service (the local fake in development and tests, the hosted service by default).
  UPLOADTHING_INGEST_URL: z.url().optional(),
  UPLOADTHING_UFS_HOST: z.string().min(1).optional(),
  // Also read by the photo reader, which signs the store's URLs without loading the SDK
  // (server/storage/store-config.ts, through parseUploadToken below).
  UPLOADTHING_TOKEN: z.string().optional(),
  UPLOADTHING_UFS_APP_ID_LOCATION: z.string().optional(),
  COOKIE_SECURE: bool.optional(),
  SESSION_ABSOLUTE_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 90)
    .default(24 * 14),
  INVITE_TTL_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 30)
    .default(72),
  // How many reverse proxies in front of the app append to X-Forwarded-For. 0: the socket's
  // address is the client's (a client-sent X-Forwarded-For is ignored).
  TRUST_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
});

const BASE64 = /^(?:[A-Za-z0-9+/]{4})*(?:[A-Za-z0-9+/]{2}==|[A-Za-z0-9+/]{3}=)?$/;

/**
 * The upload service's token (base64 of `{"apiKey":"sk_…","appId":"…","regions":[…]}`), checked
 * as the SDK's schema checks it. No message carries the token's bytes: JSON.parse's own
 * SyntaxError quotes its input, so its error is replaced, never passed on.
 * @param {string | undefined} raw
 * @returns {{ apiKey: string; appId: string }}
 */
export function parseUploadToken(raw) {
  if (!raw) throw new Error('UPLOADTHING_TOKEN is not set');
  const bad = (/** @type {string} */ why) => new Error(`UPLOADTHING_TOKEN ${why}`);
  if (!BASE64.test(raw)) throw bad('is not base64');
  /** @type {unknown} */
  let token;
  try {
    token = JSON.parse(Buffer.from(raw, 'base64').toString('utf8'));
  } catch {
    throw bad('is not base64 of JSON');
  }
  const { apiKey, appId, regions } = /** @type {Record<string, unknown>} */ (token ?? {});
  if (typeof apiKey !== 'string' || !apiKey.startsWith('sk_'))
    throw bad('has no secret API key (sk_…)');
  if (typeof appId !== 'string' || !appId) throw bad('has no app id');
  if (!Array.isArray(regions) || !regions.length || regions.some((r) => typeof r !== 'string'))
    throw bad('has no regions');
  return { apiKey, appId };
}

// A production server checks the store's settings at start, not at the first photo. Unset is
// left to the start script (stack-plan's PRODUCTION_VARIABLES): production builds of the tests
// and benches run without a store.
const checked = schema.superRefine((v, ctx) => {
  if (v.NODE_ENV !== 'production') return;
  if (v.UPLOADTHING_TOKEN !== undefined) {
    try {
      parseUploadToken(v.UPLOADTHING_TOKEN);
    } catch (error) {
      ctx.addIssue({
        code: 'custom',
        path: ['UPLOADTHING_TOKEN'],
        message: /** @type {Error} */ (error).message.replace(/^UPLOADTHING_TOKEN /, ''),
      });
    }
  }
  const location = v.UPLOADTHING_UFS_APP_ID_LOCATION;
  if (location !== undefined && location !== 'subdomain' && location !== 'path')
    ctx.addIssue({
      code: 'custom',
      path: ['UPLOADTHING_UFS_APP_ID_LOCATION'],
      message: 'must be "subdomain" or "path"',
    });
});

/** @typedef {z.infer<typeof schema>} Env */

/** @returns {Env} */
function parseEnv() {
  const parsed = checked.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map(
      (i) => `  - ${i.path.join('.') || '(env)'}: ${i.message}`,
    );
    throw new Error(`Ringpass configuration is invalid:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** @type {Env | undefined} */
let cached;

/** The validated environment, parsed on first use. */
export function env() {
  cached ??= parseEnv();
  return cached;
}

/** Validates without caching: for next.config.mjs and the start scripts. */
export function assertEnv() {
  parseEnv();
}

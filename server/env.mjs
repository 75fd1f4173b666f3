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
  // Also read by the report's photo reader, which signs the store's URLs without loading the SDK
  // (features/reports/server/store-url.ts); checked there, as the SDK checks them.
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

/** @typedef {z.infer<typeof schema>} Env */

/** @returns {Env} */
function parseEnv() {
  const parsed = schema.safeParse(process.env);
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

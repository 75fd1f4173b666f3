import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { assertEnv } from '@/server/env.mjs';

const SECRET = 'sk_live_0123456789abcdef';
const token = (fields: Record<string, unknown>) =>
  Buffer.from(JSON.stringify(fields)).toString('base64');

/** What assertEnv says about this configuration, or null when it accepts it. */
function startWith(vars: Record<string, string | undefined>): string | null {
  for (const [name, value] of Object.entries(vars)) vi.stubEnv(name, value);
  try {
    assertEnv();
    return null;
  } catch (error) {
    return (error as Error).message;
  }
}

beforeEach(() => {
  vi.stubEnv('DATABASE_URL', 'postgres://127.0.0.1:5432/ringpass');
  vi.stubEnv('SMTP_URL', 'smtp://127.0.0.1:2525');
  vi.stubEnv('UPLOADTHING_TOKEN', undefined);
  vi.stubEnv('UPLOADTHING_UFS_APP_ID_LOCATION', undefined);
});
afterEach(() => vi.unstubAllEnvs());

describe("a production server's start checks the photo store's settings", () => {
  it('refuses a token that is not the service token, naming it without quoting it', () => {
    for (const bad of [
      `${SECRET}!not-base64`,
      Buffer.from(`{"apiKey":${SECRET}}`).toString('base64'),
      token({ apiKey: 'pk_live_0123', appId: 'a', regions: ['sea1'] }),
    ]) {
      const message = startWith({ NODE_ENV: 'production', UPLOADTHING_TOKEN: bad });
      expect(message).toMatch(/UPLOADTHING_TOKEN: /);
      expect(message).not.toContain('sk_live');
    }
  });

  it('refuses an app id location other than subdomain or path', () => {
    const good = token({ apiKey: SECRET, appId: 'a', regions: ['sea1'] });
    expect(
      startWith({
        NODE_ENV: 'production',
        UPLOADTHING_TOKEN: good,
        UPLOADTHING_UFS_APP_ID_LOCATION: 'subdomains',
      }),
    ).toMatch(/UPLOADTHING_UFS_APP_ID_LOCATION: must be "subdomain" or "path"/);
  });

  it('accepts a well-formed token; outside production the photo reader checks it at use', () => {
    const good = token({ apiKey: SECRET, appId: 'a', regions: ['sea1'] });
    expect(startWith({ NODE_ENV: 'production', UPLOADTHING_TOKEN: good })).toBeNull();
    expect(startWith({ NODE_ENV: 'development', UPLOADTHING_TOKEN: 'garbled' })).toBeNull();
  });
});

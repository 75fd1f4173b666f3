import { describe, expect, it } from 'vitest';
import { storeConfigFrom } from '@/server/storage/store-config';

const base64 = (text: string) => Buffer.from(text).toString('base64');
const token = (fields: Record<string, unknown>) => base64(JSON.stringify(fields));
const SECRET = 'sk_live_0123456789abcdef';
const good = token({ apiKey: SECRET, appId: 'k2p9zx1q', regions: ['sea1'] });

/** The error `storeConfigFrom` throws for these variables (fails the test when none is thrown). */
function refusal(vars: Parameters<typeof storeConfigFrom>[0]): Error {
  try {
    storeConfigFrom(vars);
  } catch (error) {
    return error as Error;
  }
  throw new Error('the configuration was accepted');
}

describe("the photo store's configuration", () => {
  it('is read from the variables the SDK reads, with its defaults', () => {
    expect(storeConfigFrom({ UPLOADTHING_TOKEN: good })).toEqual({
      apiKey: SECRET,
      appId: 'k2p9zx1q',
      ufsHost: 'ufs.sh',
      appIdLocation: 'subdomain',
    });
    expect(
      storeConfigFrom({
        UPLOADTHING_TOKEN: good,
        UPLOADTHING_UFS_HOST: 'localhost:2530',
        UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
      }),
    ).toMatchObject({ ufsHost: 'localhost:2530', appIdLocation: 'path' });
  });

  it('refuses an unset token by name', () => {
    expect(refusal({}).message).toBe('UPLOADTHING_TOKEN is not set');
    expect(refusal({ UPLOADTHING_TOKEN: '' }).message).toBe('UPLOADTHING_TOKEN is not set');
  });

  it('refuses a token that is not base64, or not base64 of JSON, without quoting it', () => {
    const notBase64 = `${SECRET}!{"apiKey"`;
    expect(refusal({ UPLOADTHING_TOKEN: notBase64 }).message).toBe(
      'UPLOADTHING_TOKEN is not base64',
    );
    // Valid base64 of broken JSON whose SyntaxError from V8 quotes it: `Unexpected token 's',
    // ..."{"apiKey":sk_live_01"... is not valid JSON`.
    const broken = base64(`{"apiKey":${SECRET}}`);
    const error = refusal({ UPLOADTHING_TOKEN: broken });
    expect(error.message).toBe('UPLOADTHING_TOKEN is not base64 of JSON');
    expect(`${error.message} ${String(error.cause ?? '')} ${error.stack}`).not.toContain('sk_live');
  });

  it('refuses a token without a secret key (sk_…), app id or regions', () => {
    const publishable = token({ apiKey: 'pk_live_0123', appId: 'a', regions: ['sea1'] });
    expect(refusal({ UPLOADTHING_TOKEN: publishable }).message).toBe(
      'UPLOADTHING_TOKEN has no secret API key (sk_…)',
    );
    expect(
      refusal({ UPLOADTHING_TOKEN: token({ apiKey: SECRET, regions: ['sea1'] }) }).message,
    ).toBe('UPLOADTHING_TOKEN has no app id');
    expect(
      refusal({ UPLOADTHING_TOKEN: token({ apiKey: SECRET, appId: 'a', regions: [] }) }).message,
    ).toBe('UPLOADTHING_TOKEN has no regions');
  });

  it('refuses an app id location other than subdomain or path', () => {
    expect(
      refusal({ UPLOADTHING_TOKEN: good, UPLOADTHING_UFS_APP_ID_LOCATION: 'Subdomain' }).message,
    ).toBe('UPLOADTHING_UFS_APP_ID_LOCATION must be "subdomain" or "path"');
  });
});

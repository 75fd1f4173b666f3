import { UTApi } from 'uploadthing/server';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { signedFileUrl } from '@/server/storage/signed-url';
import type { StoreConfig } from '@/server/storage/store-config';

const token = (apiKey: string, appId: string) =>
  Buffer.from(JSON.stringify({ apiKey, appId, regions: ['sea1'] })).toString('base64');
const KEY = 'Vx3kq9Pz0LbRtYw2MnCd5EfGhJ7aSuQ1iOpZlKxTcVbN8mW4';

/** The SDK's own signed URL for `key`, read from the same variables (the clock is frozen). */
async function sdkUrl(config: StoreConfig) {
  vi.stubEnv('UPLOADTHING_TOKEN', token(config.apiKey, config.appId));
  vi.stubEnv('UPLOADTHING_UFS_HOST', config.ufsHost);
  vi.stubEnv('UPLOADTHING_UFS_APP_ID_LOCATION', config.appIdLocation);
  vi.stubEnv('UPLOADTHING_LOG_LEVEL', 'Error');
  return (await new UTApi().generateSignedURL(KEY, { expiresIn: 60 })).ufsUrl;
}

afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllEnvs();
});

describe("the store's signed photo URLs", () => {
  const now = Date.UTC(2026, 11, 2, 10, 30);
  it.each<StoreConfig>([
    { apiKey: 'sk_live_4f1e9a', appId: 'k2p9zx1q', ufsHost: 'ufs.sh', appIdLocation: 'subdomain' },
    {
      apiKey: 'sk_test_local',
      appId: 'ringpass-local',
      ufsHost: 'localhost:2530',
      appIdLocation: 'path',
    },
  ])(
    'are the URL the upload SDK signs ($ufsHost, app id in the $appIdLocation)',
    async (config) => {
      vi.useFakeTimers({ now, toFake: ['Date'] });
      const ours = await signedFileUrl(config, KEY, 60);
      expect(ours).toBe(await sdkUrl(config));
      expect(new URL(ours).searchParams.get('expires')).toBe(String(now + 60_000));
    },
  );

  it('change with the key that signs them and never carry it', async () => {
    vi.useFakeTimers({ now, toFake: ['Date'] });
    const config: StoreConfig = {
      apiKey: 'sk_live_a',
      appId: 'app',
      ufsHost: 'ufs.sh',
      appIdLocation: 'subdomain',
    };
    const a = await signedFileUrl(config, KEY, 60);
    const b = await signedFileUrl({ ...config, apiKey: 'sk_live_b' }, KEY, 60);
    expect(a).not.toBe(b);
    expect(a).not.toContain('sk_live_a');
  });
});

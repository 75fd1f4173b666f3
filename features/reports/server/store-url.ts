import 'server-only';
import { createHmac } from 'node:crypto';
import { env } from '@/server/env.mjs';

/**
 * Short-lived signed URLs of the upload service's private files, for reading the report's photos.
 *
 * Made exactly as the SDK's `UTApi.generateSignedURL` makes them (uploadthing 7.7: the file's URL
 * plus `expires`, signed with HMAC-SHA256 by the token's API key and appended as
 * `signature=hmac-sha256=<hex>`), without loading the SDK: its effect runtime is about 70 MB of
 * resident memory in a process that only ever reads photos (the queue's worker, which builds the
 * customer e-mail's PDF). Uploads keep the SDK. `tests/unit/features/reports/store-url.test.ts`
 * holds this equal to the SDK's own URL, so an SDK upgrade that signs differently fails there.
 */
export type StoreConfig = {
  apiKey: string;
  appId: string;
  ufsHost: string;
  appIdLocation: 'subdomain' | 'path';
};

/** The store's settings, from the variables the SDK reads (and with its defaults). */
export function storeConfig(): StoreConfig {
  const { UPLOADTHING_TOKEN, UPLOADTHING_UFS_HOST, UPLOADTHING_UFS_APP_ID_LOCATION } = env();
  if (!UPLOADTHING_TOKEN) throw new Error('UPLOADTHING_TOKEN is not set');
  const token = JSON.parse(Buffer.from(UPLOADTHING_TOKEN, 'base64').toString('utf8')) as unknown;
  const { apiKey, appId } = (token ?? {}) as { apiKey?: unknown; appId?: unknown };
  if (typeof apiKey !== 'string' || !apiKey.startsWith('sk_') || typeof appId !== 'string')
    throw new Error('UPLOADTHING_TOKEN is not a token of the upload service');
  const location = UPLOADTHING_UFS_APP_ID_LOCATION ?? 'subdomain';
  if (location !== 'subdomain' && location !== 'path')
    throw new Error('UPLOADTHING_UFS_APP_ID_LOCATION must be "subdomain" or "path"');
  return { apiKey, appId, ufsHost: UPLOADTHING_UFS_HOST ?? 'ufs.sh', appIdLocation: location };
}

/** A URL that reads the private file `fileKey` for `ttlSeconds` from `now`. */
export function signedFileUrl(
  fileKey: string,
  ttlSeconds: number,
  config: StoreConfig = storeConfig(),
  now = Date.now(),
): string {
  const { apiKey, appId, ufsHost, appIdLocation } = config;
  // As the SDK: plain http only for a local host (its own test servers, our upload fake).
  const proto = ufsHost.includes('local') ? 'http' : 'https';
  const url = new URL(
    appIdLocation === 'subdomain'
      ? `${proto}://${appId}.${ufsHost}/f/${fileKey}`
      : `${proto}://${ufsHost}/a/${appId}/${fileKey}`,
  );
  url.searchParams.append('expires', String(now + ttlSeconds * 1000));
  const signature = createHmac('sha256', apiKey).update(url.toString()).digest('hex');
  url.searchParams.append('signature', `hmac-sha256=${signature}`);
  return url.href;
}

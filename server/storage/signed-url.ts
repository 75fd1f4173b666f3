import 'server-only';
import { generateSignedURL } from '@uploadthing/shared';
import * as Micro from 'effect/Micro';
import * as Redacted from 'effect/Redacted';
import type { StoreConfig } from './store-config';

/**
 * A short-lived URL that reads the private file `fileKey`: the base is built as the SDK's
 * `UTApi.generateSignedURL` builds it (uploadthing 7.7), the signature is the SDK's own
 * `generateSignedURL` (@uploadthing/shared). Not `UTApi`: in the queue worker's shape (which only
 * ever reads photos) `uploadthing/server` added about 50 MB resident, this signer about 5 MB over
 * the hand-written HMAC it replaces (2026-12-02, 5 alternating pairs). The unit test
 * `tests/unit/server/storage/signed-url.test.ts` holds the result equal to `UTApi.generateSignedURL`,
 * so an SDK upgrade that builds the URL differently fails there.
 */
export function signedFileUrl(
  config: StoreConfig,
  fileKey: string,
  ttlSeconds: number,
): Promise<string> {
  const { apiKey, appId, ufsHost, appIdLocation } = config;
  // As the SDK: plain http only for a local host (its own test servers, our upload fake).
  const proto = ufsHost.includes('local') ? 'http' : 'https';
  const base =
    appIdLocation === 'subdomain'
      ? `${proto}://${appId}.${ufsHost}/f/${fileKey}`
      : `${proto}://${ufsHost}/a/${appId}/${fileKey}`;
  return Micro.runPromise(
    generateSignedURL(base, Redacted.make(apiKey), { ttlInSeconds: ttlSeconds }),
  );
}

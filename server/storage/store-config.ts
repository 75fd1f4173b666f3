import 'server-only';
import { env, parseUploadToken } from '@/server/env.mjs';

/** Where the upload service keeps this app's files, and the key that signs URLs to read them. */
export type StoreConfig = {
  apiKey: string;
  appId: string;
  ufsHost: string;
  appIdLocation: 'subdomain' | 'path';
};

type StoreVariables = {
  UPLOADTHING_TOKEN?: string | undefined;
  UPLOADTHING_UFS_HOST?: string | undefined;
  UPLOADTHING_UFS_APP_ID_LOCATION?: string | undefined;
};

/**
 * The store's settings from the variables the SDK reads, with its defaults. Throws on a missing
 * or malformed token or location: callers read this before the try that turns a missing photo
 * into "not found", so a misconfigured server fails loudly instead of losing every photo.
 */
export function storeConfigFrom(vars: StoreVariables): StoreConfig {
  const { apiKey, appId } = parseUploadToken(vars.UPLOADTHING_TOKEN);
  const location = vars.UPLOADTHING_UFS_APP_ID_LOCATION ?? 'subdomain';
  if (location !== 'subdomain' && location !== 'path')
    throw new Error('UPLOADTHING_UFS_APP_ID_LOCATION must be "subdomain" or "path"');
  return { apiKey, appId, ufsHost: vars.UPLOADTHING_UFS_HOST ?? 'ufs.sh', appIdLocation: location };
}

let cached: StoreConfig | undefined;
/** This server's store settings, checked once (env() itself is read once). */
export function storeConfig(): StoreConfig {
  cached ??= storeConfigFrom(env());
  return cached;
}

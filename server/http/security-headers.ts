import 'server-only';

/**
 * The Content-Security-Policy of every page, after Next's guide for nonces: Next reads the nonce
 * from this header on the request and puts it on its own scripts, so only scripts this server
 * rendered run ('strict-dynamic' lets them load the chunks they need). Styles allow inline:
 * style attributes cannot carry a nonce, and injected CSS cannot run code.
 * Photos go straight from the phone to the upload service and come back from its file host, so
 * those two origins are allowed for connections and images; nothing else is.
 */
export type CspOptions = {
  nonce: string;
  /** Development: React's debugging needs eval. */
  dev: boolean;
  /** Served over https: ask the browser to upgrade any stray http request. */
  https: boolean;
  uploads: UploadOrigins;
};

export type UploadOrigins = { connect: string[]; img: string[] };

/** The hosted service's hosts (the SDK's defaults: <region>.ingest.uploadthing.com, <app>.ufs.sh). */
const HOSTED_UPLOADS: UploadOrigins = {
  connect: ['https://*.ingest.uploadthing.com'],
  img: ['https://*.ufs.sh', 'https://utfs.io'],
};

/** Where the upload SDK sends files and where their URLs point, from the SDK's own variables. */
export function uploadOrigins(vars: {
  UPLOADTHING_INGEST_URL?: string;
  UPLOADTHING_UFS_HOST?: string;
}): UploadOrigins {
  const connect = vars.UPLOADTHING_INGEST_URL
    ? [new URL(vars.UPLOADTHING_INGEST_URL).origin]
    : HOSTED_UPLOADS.connect;
  // The SDK uses plain http only for hosts containing "local" (the fake); files may sit under a
  // per-app subdomain of the host.
  const img = vars.UPLOADTHING_UFS_HOST
    ? [
        vars.UPLOADTHING_UFS_HOST.includes('local')
          ? `http://${vars.UPLOADTHING_UFS_HOST}`
          : `https://${vars.UPLOADTHING_UFS_HOST}`,
        `https://*.${vars.UPLOADTHING_UFS_HOST}`,
      ]
    : HOSTED_UPLOADS.img;
  return { connect, img };
}

export function contentSecurityPolicy({ nonce, dev, https, uploads }: CspOptions): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' blob: data: ${uploads.img.join(' ')}`,
    "font-src 'self'",
    `connect-src 'self' ${uploads.connect.join(' ')}`,
    // The runner's service worker (/runner-sw/sw.js, app/runner-sw/[path]/route.ts) is this
    // origin's own file.
    "worker-src 'self'",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ];
  if (https) directives.push('upgrade-insecure-requests');
  return directives.join('; ');
}

/** Two years, the common preload figure; sent only when the app is served over https. */
export const HSTS = 'max-age=63072000';

/** A fresh, unguessable nonce per response (128 bits, base64). */
export function newNonce(): string {
  return Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64');
}

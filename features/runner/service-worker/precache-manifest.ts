import 'server-only';
import { readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import type { InjectManifestOptions } from '@serwist/turbopack';
import { runnerFiles } from './runner-files';

type ManifestTransform = NonNullable<InjectManifestOptions['manifestTransforms']>[number];

/**
 * Serwist lists the build's files (entries named `<distDir>static/…`, relative to the project;
 * fonts left out); a phone needs the runner's, its font included. Precaches exactly those (their
 * names carry a content hash, so no revision), or Serwist's own list, with a warning in the
 * build's log, when the runner route's manifests cannot be read.
 */
export const runnerPrecacheOnly: ManifestTransform = (entries) => {
  const sample = entries.find((e) => e.url.includes('static/'));
  if (!sample) return { manifest: entries, warnings: [] };
  const distDir = sample.url.slice(0, sample.url.indexOf('static/'));
  // Only files of this build's output are read (turbopackIgnore: not traced into the server bundle).
  const inDistDir = (file: string) => path.join(/*turbopackIgnore: true*/ distDir, file);
  const files = runnerFiles((file) => {
    try {
      return readFileSync(inDistDir(file), 'utf8');
    } catch {
      return null;
    }
  });
  if (!files)
    return {
      manifest: entries,
      warnings: ['The runner route’s build manifests were not found: precaching the whole build.'],
    };
  const manifest = [...files].sort().map((file) => ({
    url: `${distDir}${file}`,
    revision: null,
    size: statSync(inDistDir(file)).size,
  }));
  return { manifest, warnings: [] };
};

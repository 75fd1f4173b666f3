/**
 * Whether the e2e build in .next-e2e was made from the sources as they are now, so a run (or a
 * developer's run of one spec) does not spend minutes building what is already built.
 */
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';

// What the app is built from; tests, reports and generated folders are not part of the build.
const SOURCES = ['app', 'features', 'server', 'db', 'public', 'fonts'];
const FILES = [
  'package-lock.json',
  'next.config.mjs',
  'tsconfig.json',
  'tailwind.config.ts',
  'postcss.config.mjs',
  'proxy.ts',
  'instrumentation.ts',
];
const STAMP = 'ringpass-sources.sha256';

function* walk(dir: string): Generator<string> {
  // A source folder may be absent (git keeps no empty folder: public/ went with its last file).
  if (!existsSync(dir)) return;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* walk(full);
    else if (entry.isFile()) yield full;
  }
}

/** A hash of every source file's path, size and modification time, and of the build's settings. */
export function sourceFingerprint(root: string, buildEnv: Record<string, string>): string {
  const hash = createHash('sha256');
  const files = [
    ...SOURCES.flatMap((dir) => [...walk(path.join(root, dir))]),
    ...FILES.map((f) => path.join(root, f)),
  ].sort();
  for (const file of files) {
    const stat = statSync(file, { throwIfNoEntry: false });
    hash.update(`${path.relative(root, file)}\0${stat?.size}\0${stat?.mtimeMs}\n`);
  }
  hash.update(JSON.stringify(Object.entries(buildEnv).sort()));
  return hash.digest('hex');
}

/** True when `distDir` holds a finished build stamped with this fingerprint. */
export function builtFrom(distDir: string, fingerprint: string): boolean {
  try {
    statSync(path.join(distDir, 'BUILD_ID'));
    return readFileSync(path.join(distDir, STAMP), 'utf8') === fingerprint;
  } catch {
    return false;
  }
}

export function stampBuild(distDir: string, fingerprint: string) {
  writeFileSync(path.join(distDir, STAMP), fingerprint);
}

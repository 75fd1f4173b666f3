/**
 * The runner's offline shell in a finished build: the service worker's size and its precache
 * manifest (entries, bytes raw and gzip), beside the whole build's static files for scale.
 * `npx tsx tests/bench/offline-shell.ts [distDir]` (default .next-e2e; reads files, builds nothing).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

const distDir = process.argv[2] ?? '.next-e2e';
const sw = readFileSync(path.join(distDir, 'server/app/runner-sw/sw.js.body'));
const urls = [...sw.toString('utf8').matchAll(/url:"([^"]+)"/g)].map((m) => m[1]!);
const fileOf = (url: string) => path.join(distDir, url.replace(/^\/_next\//, ''));

const sizes = (files: string[]) =>
  files.reduce(
    (sum, file) => {
      const bytes = readFileSync(file);
      return { raw: sum.raw + bytes.length, gzip: sum.gzip + gzipSync(bytes).length };
    },
    { raw: 0, gzip: 0 },
  );
const walk = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? walk(path.join(dir, e.name)) : [path.join(dir, e.name)],
  );
const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;

const precache = sizes(urls.map(fileOf));
const all = sizes(walk(path.join(distDir, 'static')).filter((f) => statSync(f).isFile()));
console.log(`build ${distDir} (${readFileSync(path.join(distDir, 'BUILD_ID'), 'utf8')})`);
console.log(
  `service worker /runner-sw/sw.js: ${kb(sw.length)} raw, ${kb(gzipSync(sw).length)} gzip`,
);
console.log(
  `precache manifest: ${urls.length} entries, ${kb(precache.raw)} raw, ${kb(precache.gzip)} gzip`,
);
console.log(
  `whole build's static files: ${walk(path.join(distDir, 'static')).length} files, ${kb(all.raw)} raw, ${kb(all.gzip)} gzip`,
);

/**
 * Which modules a route's first-load JavaScript holds, per chunk, in gzip bytes:
 * `npx tsx tests/bench/route-modules.ts [route] [minBytes]` (default the runner, 250 B).
 * Builds the committed HEAD (or ROUTE_MODULES_REV) in a scratch copy (git archive; node_modules hard-linked; others'
 * uncommitted work and the shared build folders left alone) with browser source maps on, then
 * gives every byte of each chunk in the route's `firstLoadChunkPaths` to the source its source-map
 * segment names (Turbopack hoists several modules into one function, so functions are not
 * modules). A source's share is gzip(chunk) − gzip(chunk without its bytes): what leaving it out
 * would save. Shares undercount a little (bytes compress against their neighbours); chunk sizes
 * are exact. The browser does not fetch every listed chunk (bench:pages counts what it fetches).
 * ROUTE_MODULES_DIR=<dir> reads the build an earlier run left (its last line names the folder).
 */
import { execSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { ROOT } from '../helpers/test-services';

type RawMap = {
  sources?: string[];
  mappings?: string;
  sections?: { offset: { line: number; column: number }; map: RawMap }[];
};
const B64 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';

/** Each segment's generated line/column (0-based) and source, sections included (Source Map v3). */
function segments(
  map: RawMap,
  line0 = 0,
  col0 = 0,
): { line: number; col: number; source: string }[] {
  if (map.sections)
    return map.sections.flatMap((s) => segments(s.map, line0 + s.offset.line, s.offset.column));
  const out: { line: number; col: number; source: string }[] = [];
  let source = 0;
  (map.mappings ?? '').split(';').forEach((text, line) => {
    let col = 0;
    for (const seg of text.split(',')) {
      if (!seg) continue;
      const fields: number[] = [];
      for (let i = 0, value = 0, shift = 0; i < seg.length; i++) {
        const digit = B64.indexOf(seg[i]!);
        value += (digit & 31) << shift;
        if (digit & 32) shift += 5;
        else {
          fields.push(value & 1 ? -(value >>> 1) : value >>> 1);
          value = shift = 0;
        }
      }
      col += fields[0]!;
      if (fields.length > 1) source += fields[1]!;
      out.push({
        line: line0 + line,
        col: (line === 0 ? col0 : 0) + col,
        source: fields.length > 1 ? (map.sources?.[source] ?? '?') : '(chunk glue)',
      });
    }
  });
  return out;
}

const route = process.argv[2] ?? '/jobs/[jobId]/wheels/[wheelId]/run';
const minBytes = Number(process.argv[3] ?? 250);
const gz = (text: string) => gzipSync(text, { level: 6 }).length;
const kb = (bytes: number) => (bytes / 1024).toFixed(2).padStart(6);

// ROUTE_MODULES_REV=<commit>: build that commit instead of HEAD (a before/after on the same method).
const REV = process.env.ROUTE_MODULES_REV ?? 'HEAD';
if (!/^[\w./~^-]+$/.test(REV)) throw new Error(`not a revision: ${REV}`);
// ROUTE_MODULES_DIR=<dir>: read the build a previous run left there instead of building again.
const dir = process.env.ROUTE_MODULES_DIR ?? buildHead();

function buildHead() {
  const scratch = mkdtempSync(path.join(tmpdir(), 'ringpass-route-modules-'));
  execSync(
    `git archive ${REV} | tar -x -C ${scratch} && cp -al node_modules ${scratch}/node_modules`,
    { cwd: ROOT },
  );
  const config = path.join(scratch, 'next.config.mjs');
  writeFileSync(
    config,
    readFileSync(config, 'utf8').replace(
      'const nextConfig = {',
      'const nextConfig = {\n  productionBrowserSourceMaps: true,',
    ),
  );
  execSync('node_modules/.bin/next build', {
    cwd: scratch,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      NEXT_DIST_DIR: '.next',
      RINGPASS_BUILD_SKIP_TYPECHECK: '1',
      DATABASE_URL: 'postgres://build@127.0.0.1:1/build',
      SMTP_URL: 'smtp://127.0.0.1:1',
    },
  });
  return scratch;
}

const stats = JSON.parse(
  readFileSync(path.join(dir, '.next/diagnostics/route-bundle-stats.json'), 'utf8'),
) as { route: string; firstLoadChunkPaths: string[] }[];
const chunks = stats.find((r) => r.route === route)?.firstLoadChunkPaths;
if (!chunks) throw new Error(`no route ${route} in route-bundle-stats.json`);

let total = 0;
for (const chunk of chunks) {
  const file = path.join(dir, chunk);
  const full = readFileSync(file, 'utf8');
  const mapName = /sourceMappingURL=(\S+)/.exec(full)?.[1];
  const src = full.replace(/\n*\/\/# sourceMappingURL=.*\s*$/, '');
  const size = gz(src);
  total += size;
  const lineStarts = [0];
  for (let i = src.indexOf('\n'); i !== -1; i = src.indexOf('\n', i + 1)) lineStarts.push(i + 1);
  const owned = new Map<string, [number, number][]>();
  if (mapName) {
    const map = JSON.parse(readFileSync(path.join(path.dirname(file), mapName), 'utf8')) as RawMap;
    const marks = segments(map).map((m) => ({
      at: lineStarts[m.line]! + m.col,
      source: m.source.replace(/^turbopack:\/\/\/(\[project\]\/)?/, ''),
    }));
    marks.sort((a, b) => a.at - b.at);
    marks.forEach((m, i) => {
      const ranges = owned.get(m.source) ?? [];
      ranges.push([m.at, marks[i + 1]?.at ?? src.length]);
      owned.set(m.source, ranges);
    });
  }
  const rows = [...owned].map(([source, ranges]) => {
    let rest = '';
    let at = 0;
    for (const [from, to] of ranges) {
      rest += src.slice(at, from);
      at = to;
    }
    return { source, share: size - gz(rest + src.slice(at)) };
  });
  rows.sort((a, b) => b.share - a.share);
  console.log(`== ${path.basename(chunk)} ${kb(size)} kB gzip, ${rows.length} sources`);
  for (const r of rows.filter((x) => x.share >= minBytes))
    console.log(`   ${kb(r.share)}  ${r.source}`);
}
console.log(`${route}: ${chunks.length} chunks, ${kb(total)} kB gzip (level 6) — build in ${dir}`);

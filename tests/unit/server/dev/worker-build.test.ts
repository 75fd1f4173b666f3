import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { buildSync, type Metafile } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { WORKER, workerBuildOptions } from '@/server/dev/worker-build';

const ROOT = path.resolve(import.meta.dirname, '..', '..', '..', '..');
const OUTDIR = `.data/test-worker-build-${process.pid}`;

let metafile: Metafile;
const outputs = () => Object.entries(metafile.outputs).filter(([file]) => file.endsWith('.mjs'));
const entryOutput = () => outputs().find(([, o]) => o.entryPoint === WORKER.entry)!;
const packageImports = (o: Metafile['outputs'][string]) =>
  o.imports.filter((i) => i.external && !i.path.startsWith('node:')).map((i) => i.path);

beforeAll(() => {
  // The very options `npm run worker` and npm start build with, into a folder of this test's own.
  metafile = buildSync({
    ...workerBuildOptions({ ...WORKER, outdir: OUTDIR }),
    metafile: true,
  }).metafile!;
});
afterAll(() => rmSync(path.join(ROOT, OUTDIR), { recursive: true, force: true }));

describe('the compiled queue worker (npm run worker, npm start)', () => {
  it("bundles server-only's empty module, so the app's server-only guard cannot stop the worker", () => {
    const imported = outputs().flatMap(([, o]) => packageImports(o));
    expect(imported).not.toContain('server-only');
    const code = outputs()
      .map(([file]) => readFileSync(path.join(ROOT, file), 'utf8'))
      .join('\n');
    expect(code).not.toContain('cannot be imported from a Client Component');
    expect(code).toContain('app/_worker/run.ts');
  });

  it('loads the PDF library only with the first report, from a chunk of its own', () => {
    const [, entry] = entryOutput();
    expect(packageImports(entry)).not.toContain('@react-pdf/renderer');
    const pdfChunks = outputs().filter(([, o]) =>
      packageImports(o).includes('@react-pdf/renderer'),
    );
    expect(pdfChunks).toHaveLength(1);
    expect(entry.imports.some((i) => i.kind === 'dynamic-import' && !i.external)).toBe(true);
  });

  it('imports only packages that plain node can load as they are installed', () => {
    // A package without an exports map imported by a subpath without its extension (next/navigation)
    // loads under tsx and bundlers but not under node: the worker would die on start.
    const specifiers = [...new Set(outputs().flatMap(([, o]) => packageImports(o)))];
    const load = spawnSync(
      process.execPath,
      [
        '--input-type=module',
        '-e',
        `for (const s of ${JSON.stringify(specifiers)}) await import(s).catch((e) => { console.error(s, e.code); process.exitCode = 1; });`,
      ],
      { cwd: ROOT, encoding: 'utf8', env: { ...process.env, NODE_ENV: 'production' } },
    );
    expect(load.stderr).toBe('');
    expect(load.status).toBe(0);
  }, 30_000);
});

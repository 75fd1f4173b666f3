/**
 * Compiles the queue's worker (app/_worker/run.ts) to plain ESM so it runs under `node` alone:
 * under tsx it was two processes (tsx's launcher beside it, ~47 MB) and its compiler hooks stayed
 * resident in the worker (bench:report: peaks 302–335 MB under tsx, 244–288 MB bundled).
 *
 * Our code is bundled; packages stay external, so native modules (sharp, @node-rs/argon2) and the
 * PDF library load from node_modules as installed. Splitting keeps each dynamic import (the PDF
 * library, features/reports/pdf/render-pdf.tsx) in its own chunk: in a single file esbuild hoists
 * a lazily imported module's package imports to the top, which would load the PDF library at
 * start. `server-only` becomes its package's empty module, as server-only-hook.mjs does for tsx:
 * the guard throws outside React's server build, which the worker cannot use (DEVELOPERS.md).
 * Files read at run time (fonts/) are found from the working directory, the repository.
 *
 * `tsx server/dev/worker-build.ts` builds into .data/worker/ (git-ignored); `npm run worker`
 * then runs `node .data/worker/run.mjs`.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSync, type BuildOptions } from 'esbuild';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

export type WorkerBuild = {
  /** The entry, relative to the repository (the worker's run.ts, or a bench of its shape). */
  entry: string;
  /** The output folder, relative to the repository. */
  outdir: string;
};

export const WORKER: WorkerBuild = { entry: 'app/_worker/run.ts', outdir: '.data/worker' };

/** The esbuild options for one worker-shaped entry. Pure, so the choices are tested. */
export function workerBuildOptions(build: WorkerBuild, root = ROOT): BuildOptions {
  return {
    absWorkingDir: root,
    entryPoints: { [path.parse(build.entry).name]: build.entry },
    outdir: build.outdir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    packages: 'external',
    // Resolves `@/…` (paths) and sets the JSX transform (react-jsx) as the app's compiler does.
    tsconfig: 'tsconfig.json',
    // An alias is resolved from absWorkingDir and bundled (the package does not export empty.js).
    alias: {
      'server-only': './node_modules/server-only/empty.js',
      // Next has no exports map, so Node's ESM loader finds only the file's full name (tsx and
      // bundlers add the .js themselves). server/errors.ts and the guards import it.
      'next/navigation': 'next/navigation.js',
    },
    logLevel: 'warning',
  };
}

/**
 * Builds `build` (by default the worker) and returns the absolute path of its entry file. The
 * folder is not emptied first: a worker already running (npm start beside the e2e server, or
 * `npm run worker` beside npm start) loads its PDF chunk only with its first report, by a name
 * that carries the chunk's content hash, so an older chunk must stay where it was.
 */
export function buildWorker(build: WorkerBuild = WORKER, root = ROOT): string {
  buildSync(workerBuildOptions(build, root));
  return workerEntryFile(build, root);
}

export function workerEntryFile(build: WorkerBuild = WORKER, root = ROOT): string {
  return path.join(root, build.outdir, `${path.parse(build.entry).name}.mjs`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  console.log(`[worker] built ${path.relative(ROOT, buildWorker())}`);
}

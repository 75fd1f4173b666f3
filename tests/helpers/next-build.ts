import { readFileSync } from 'node:fs';
import path from 'node:path';

/** A server action's id in a production build (it changes when a build gets a new key). */
export function serverActionId(distDir: string, exportedName: string): string {
  const file = path.join(distDir, 'server', 'server-reference-manifest.json');
  const manifest = JSON.parse(readFileSync(file, 'utf8')) as {
    node: Record<string, { exportedName?: string }>;
  };
  const found = Object.entries(manifest.node).find(
    ([, entry]) => entry.exportedName === exportedName,
  );
  if (!found) throw new Error(`No server action named ${exportedName} in ${file}`);
  return found[0];
}

import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '../../..');
const SOURCES = ['api', 'shared', 'seeds', 'console/src', 'openapi', 'angular.json'];
const OUTPUTS = ['dist/server/api/main.js', 'dist/console/browser/index.html'];

function newestMtime(target: string): number {
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/**
 * The tests drive the built service, as it ships. `npm run test:browser` builds first; run directly,
 * this builds whenever an output is missing or older than any source, so a stale bundle is never tested.
 */
export default function globalSetup(): void {
  const outputs = OUTPUTS.map((file) => path.join(root, file));
  const sourceTime = Math.max(
    ...SOURCES.map((source) => path.join(root, source))
      .filter(existsSync)
      .map(newestMtime),
  );
  const stale = outputs.some((file) => !existsSync(file) || statSync(file).mtimeMs < sourceTime);
  if (stale) execFileSync('npm', ['run', 'build'], { cwd: root, stdio: 'inherit' });
}

// The built client (dist/client): built again when it is missing or older than its sources. Used by
// npm start and by npm run bench (the load benchmark serves it), so neither fails on a fresh clone.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const built = path.join(root, 'dist/client/browser/index.html');
const sources = ['src', 'shared', 'public', 'angular.json', 'tsconfig.json', 'tsconfig.app.json', 'package-lock.json'];

/** Newest modification time under a file or folder. */
function newest(p) {
  const s = statSync(p);
  if (!s.isDirectory()) return s.mtimeMs;
  return readdirSync(p).reduce((m, name) => Math.max(m, newest(path.join(p, name))), s.mtimeMs);
}

/** Builds the client unless a build newer than every source is there; exits the process if the build fails. */
export function ensureClientBuilt() {
  const sourceTime = Math.max(...sources.map((s) => path.join(root, s)).filter(existsSync).map(newest));
  if (existsSync(built) && statSync(built).mtimeMs >= sourceTime) return;
  console.log('Building the client (it is missing or older than its sources)…');
  const r = spawnSync('npx', ['ng', 'build'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

// npm start: build the client when it is missing or older than its sources, then serve with the demo on.
import { spawnSync, spawn } from 'node:child_process';
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

const sourceTime = Math.max(...sources.map((s) => path.join(root, s)).filter(existsSync).map(newest));
if (!existsSync(built) || statSync(built).mtimeMs < sourceTime) {
  console.log('Building the client (it is missing or older than its sources)…');
  const r = spawnSync('npx', ['ng', 'build'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

const env = { ...process.env, HUELEDGER_DEMO: process.env.HUELEDGER_DEMO ?? '1' };
const child = spawn('npm', ['run', '--silent', 'serve'], { cwd: root, stdio: 'inherit', env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code) => process.exit(code ?? 0));

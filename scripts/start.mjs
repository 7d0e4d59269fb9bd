// npm start: build the client when it is missing or older than its sources, then serve with the demo on.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { ensureClientBuilt } from './client-build.mjs';

const root = path.resolve(import.meta.dirname, '..');
ensureClientBuilt();

const env = { ...process.env, HUELEDGER_DEMO: process.env.HUELEDGER_DEMO ?? '1' };
const child = spawn('npm', ['run', '--silent', 'serve'], { cwd: root, stdio: 'inherit', env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code) => process.exit(code ?? 0));

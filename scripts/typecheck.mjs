// npm run typecheck: the client, its specs and the server (with the tests, benchmarks and scripts)
// checked by tsc side by side, one process each, since tsc uses one core; each failing project's
// errors are printed whole, one project after another.
import { spawn } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const tsc = path.join(root, 'node_modules/typescript/bin/tsc');
const projects = ['tsconfig.app.json', 'tsconfig.spec.json', 'server/tsconfig.json'];

const failed = await Promise.all(
  projects.map(
    (project) =>
      new Promise((resolve) => {
        const child = spawn(process.execPath, [tsc, '-p', project, '--noEmit'], { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] });
        let out = '';
        child.stdout.on('data', (d) => (out += d));
        child.stderr.on('data', (d) => (out += d));
        child.on('close', (code) => {
          if (code !== 0) process.stdout.write(`tsc -p ${project} --noEmit failed:\n${out}\n`);
          resolve(code !== 0);
        });
      }),
  ),
);
process.exit(failed.some(Boolean) ? 1 : 0);

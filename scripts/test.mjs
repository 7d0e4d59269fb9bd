// npm test: type checks, Angular unit specs, client build, then API, reference and browser tests
// in one node:test run (its closing "# pass" / "# fail" lines are the summary).
import { spawnSync } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const env = { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' };

const steps = [
  ['type checks (client, specs, server, tests)', 'npm', ['run', '--silent', 'typecheck']],
  ['Angular unit specs (vitest)', 'npx', ['ng', 'test', '--watch=false']],
  ['client build', 'npx', ['ng', 'build']],
  [
    'API, reference and browser tests (node:test)',
    'node',
    ['scripts/node-tests.mjs', 'tests'],
  ],
];

for (const [name, cmd, args] of steps) {
  console.log(`\n=== ${name} ===`);
  const started = Date.now();
  const r = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env });
  console.log(`=== ${name}: ${r.status === 0 ? 'ok' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(1)} s ===`);
  if (r.status !== 0) process.exit(r.status ?? 1);
}

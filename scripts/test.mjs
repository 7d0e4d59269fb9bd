// npm test: type checks, Angular unit specs, client build, then API, reference, benchmark-smoke and
// browser tests (node:test, two processes at a time; its closing "# pass" / "# fail" lines are the
// summary). Stops at the first failing stage and ends with the time each stage took.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const scratch = mkdtempSync(path.join(tmpdir(), 'hueledger-npm-test-'));
const summaryFile = path.join(scratch, 'node-tests.json');
const env = { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', HUELEDGER_TEST_SUMMARY: summaryFile };

const stages = [
  ['type checks (client, specs, server, tests)', 'npm', ['run', '--silent', 'typecheck']],
  ['Angular unit specs (vitest)', 'npx', ['ng', 'test', '--watch=false']],
  ['client build', 'npx', ['ng', 'build']],
  ['API, reference, benchmark-smoke and browser tests (node:test)', 'node', ['scripts/node-tests.mjs', 'tests']],
];

const took = [];
let status = 0;
for (const [name, cmd, args] of stages) {
  console.log(`\n=== ${name} ===`);
  const started = Date.now();
  const r = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env });
  status = r.status ?? 1;
  took.push([name, (Date.now() - started) / 1000, status === 0 ? 'ok' : 'FAILED']);
  if (status !== 0) break;
}

console.log('\n=== npm test: time per stage ===');
for (const [name, seconds, result] of took) console.log(`${seconds.toFixed(1).padStart(7)} s  ${result.padEnd(6)}  ${name}`);
console.log(`${took.reduce((s, [, t]) => s + t, 0).toFixed(1).padStart(7)} s  in all`);
if (existsSync(summaryFile)) {
  const { pass, fail, skipped } = JSON.parse(readFileSync(summaryFile, 'utf8'));
  console.log(`# pass ${pass}\n# fail ${fail}\n# skipped ${skipped}`);
}
rmSync(scratch, { recursive: true, force: true });
process.exit(status);

// Runs the node:test files (*.test.ts) under the given folders with tsx and the server's tsconfig,
// several files at a time (each file is its own process with its own temporary data folder), and
// prints each file's TAP output whole when that file ends, so the output reads in order. Ends with
// the time each file took, then one closing count over all files in node:test's own words.
//   node scripts/node-tests.mjs [--jobs N] folder-or-file…
// Node 20's --test takes no globs, so the files are listed here.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const args = process.argv.slice(2);
let jobs = Math.max(1, Math.min(2, availableParallelism()));
const jobsAt = args.indexOf('--jobs');
if (jobsAt >= 0) {
  jobs = Math.max(1, Number(args[jobsAt + 1]) || 1);
  args.splice(jobsAt, 2);
}
const targets = args.length ? args : ['tests'];

function testFiles(p) {
  if (!existsSync(p)) return [];
  if (statSync(p).isFile()) return p.endsWith('.test.ts') ? [p] : [];
  return readdirSync(p, { withFileTypes: true }).flatMap((e) => (e.name === 'node_modules' ? [] : testFiles(path.join(p, e.name))));
}

const files = [...new Set(targets.flatMap((t) => testFiles(path.resolve(root, t))))].map((f) => path.relative(root, f)).sort();
if (!files.length) {
  console.error(`No *.test.ts files under ${targets.join(', ')}.`);
  process.exit(1);
}

// The files of this run share seeded data folders (an API database, with and without the demo, and
// a browser-test server's folder), each made by the first file that needs it and copied by the
// others (tests/shared-template.ts); removed at the end.
const templateDir = mkdtempSync(path.join(tmpdir(), 'hueledger-test-template-'));

/** Runs one file in node:test (TAP) and resolves with its output, counts and wall time. */
function runFile(file) {
  return new Promise((resolve) => {
    const started = Date.now();
    const child = spawn(process.execPath, ['--import', 'tsx', '--test', '--test-reporter=tap', file], {
      cwd: root,
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', HUELEDGER_TEST_TEMPLATE_DIR: templateDir },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('close', (code) => {
      const count = (name) => Number(new RegExp(`^# ${name} (\\d+)$`, 'm').exec(out)?.[1] ?? 0);
      resolve({ file, out, code, seconds: (Date.now() - started) / 1000, pass: count('pass'), fail: count('fail'), skipped: count('skipped'), todo: count('todo') });
    });
  });
}

// The longest files (browser tests, benchmark smoke runs) start first, so the run does not end
// waiting on one long file while the other slot is idle.
const slow = (f) => /^tests\/(e2e|bench)\//.test(f);
const queue = [...files.filter(slow), ...files.filter((f) => !slow(f))];
const results = [];
async function worker() {
  for (let file = queue.shift(); file; file = queue.shift()) {
    const r = await runFile(file);
    results.push(r);
    console.log(`\n# ── ${r.file} (${r.seconds.toFixed(1)} s) ──`);
    process.stdout.write(r.out.replace(/^# (tests|suites|pass|fail|cancelled|skipped|todo|duration_ms) .*\n/gm, ''));
    // A file that crashed before reporting still counts as failed.
    if (r.code !== 0 && r.fail === 0) r.fail = 1;
  }
}
const started = Date.now();
await Promise.all(Array.from({ length: Math.min(jobs, files.length) }, worker));
rmSync(templateDir, { recursive: true, force: true });

console.log(`\n# Time per file (${jobs} at a time, ${((Date.now() - started) / 1000).toFixed(1)} s in all):`);
for (const r of [...results].sort((a, b) => b.seconds - a.seconds)) console.log(`#   ${r.seconds.toFixed(1).padStart(6)} s  ${r.fail ? 'FAILED ' : ''}${r.file}`);
const failed = results.filter((r) => r.fail);
if (failed.length) console.log(`# Failed: ${failed.map((r) => r.file).join(', ')}`);
const sum = (k) => results.reduce((s, r) => s + r[k], 0);
console.log(`# tests ${sum('pass') + sum('fail')}`);
console.log(`# pass ${sum('pass')}`);
console.log(`# fail ${sum('fail')}`);
console.log(`# skipped ${sum('skipped')}`);
// npm test repeats these counts after its stage times, so they stay the output's closing lines.
if (process.env['HUELEDGER_TEST_SUMMARY']) writeFileSync(process.env['HUELEDGER_TEST_SUMMARY'], JSON.stringify({ pass: sum('pass'), fail: sum('fail'), skipped: sum('skipped') }));
process.exit(failed.length ? 1 : 0);

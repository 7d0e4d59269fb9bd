// Runs the node:test files (*.test.ts) under the given folders with tsx and the server's tsconfig,
// several processes at a time, and prints each process's TAP output whole when it ends, so the
// output reads in order. Ends with the time each took, then one closing count over all files in
// node:test's own words.
//   node scripts/node-tests.mjs [--jobs N] [--one-per-process] folder-or-file…
// Browser and benchmark files start a server (and Chromium) of their own: each runs in its own
// process. The API and reference files only load the server's modules and open their own data
// folders, and loading those modules is most of a small file's time (about 2.5 s of CPU, measured
// with --cpu-prof), so they run in groups of up to GROUP_SIZE files per process, one file after
// another; `--one-per-process` runs every file alone, to tell whether two files disturb each other.
// Node 20's --test takes no globs, so the files are listed here; each process runs its file (or a
// small module importing its group) directly, without --test's extra runner process.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

const root = path.resolve(import.meta.dirname, '..');
const args = process.argv.slice(2);
let jobs = Math.max(1, Math.min(2, availableParallelism()));
const jobsAt = args.indexOf('--jobs');
if (jobsAt >= 0) {
  jobs = Math.max(1, Number(args[jobsAt + 1]) || 1);
  args.splice(jobsAt, 2);
}
const onePerProcess = args.includes('--one-per-process');
if (onePerProcess) args.splice(args.indexOf('--one-per-process'), 1);
const targets = args.length ? args : ['tests'];
/** At most this many API or reference files share a process (our own choice: groups short enough to balance the slots). */
const GROUP_SIZE = 9;

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

/** Runs one file, or a group of files, with node:test's TAP reporter; resolves with its output, counts and wall time. */
function runUnit(unit, index) {
  let entry = unit[0];
  if (unit.length > 1) {
    entry = path.join(templateDir, `group-${index}.mjs`);
    writeFileSync(entry, unit.map((f) => `await import(${JSON.stringify(pathToFileURL(path.join(root, f)).href)});\n`).join(''));
  }
  const name = unit.length > 1 ? `${path.dirname(unit[0])}/{${unit.map((f) => path.basename(f, '.test.ts')).join(', ')}}` : unit[0];
  return new Promise((resolve) => {
    const started = Date.now();
    const child = spawn(process.execPath, ['--import', 'tsx', '--test-reporter=tap', entry], {
      cwd: root,
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', HUELEDGER_TEST_TEMPLATE_DIR: templateDir },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('close', (code) => {
      const count = (what) => Number(new RegExp(`^# ${what} (\\d+)$`, 'm').exec(out)?.[1] ?? 0);
      resolve({ file: name, out, code, seconds: (Date.now() - started) / 1000, pass: count('pass'), fail: count('fail'), skipped: count('skipped'), todo: count('todo') });
    });
  });
}

// The longest (browser tests, benchmark smoke runs) start first, so the run does not end waiting on
// one long process while the other slots are idle.
const alone = (f) => onePerProcess || /^tests\/(e2e|bench)\//.test(f);
const groups = [];
for (const dir of [...new Set(files.filter((f) => !alone(f)).map((f) => path.dirname(f)))]) {
  const inDir = files.filter((f) => !alone(f) && path.dirname(f) === dir);
  const count = Math.ceil(inDir.length / GROUP_SIZE);
  // Spread evenly: 53 files make six groups of 8–9, not five of 9 and one of 8 left over.
  for (let g = 0; g < count; g++) groups.push(inDir.filter((_, i) => i % count === g));
}
const queue = [...files.filter(alone).map((f) => [f]), ...groups];
const results = [];
let launched = 0;
async function worker() {
  for (let unit = queue.shift(); unit; unit = queue.shift()) {
    const r = await runUnit(unit, launched++);
    results.push(r);
    console.log(`\n# ── ${r.file} (${r.seconds.toFixed(1)} s) ──`);
    process.stdout.write(r.out.replace(/^# (tests|suites|pass|fail|cancelled|skipped|todo|duration_ms) .*\n/gm, ''));
    // A file that crashed before reporting still counts as failed.
    if (r.code !== 0 && r.fail === 0) r.fail = 1;
  }
}
const began = Date.now();
await Promise.all(Array.from({ length: Math.min(jobs, queue.length) }, worker));
rmSync(templateDir, { recursive: true, force: true });

console.log(`\n# Time per process (${jobs} at a time, ${((Date.now() - began) / 1000).toFixed(1)} s in all):`);
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

// Runs the node:test files (*.test.ts) under the given folders with tsx and the server's tsconfig.
// Node 20's --test takes no globs, so the files are listed here.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const folders = process.argv.slice(2).length ? process.argv.slice(2) : ['tests'];

function testFiles(dir) {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' ? [] : testFiles(p);
    return e.name.endsWith('.test.ts') ? [p] : [];
  });
}

const files = folders.flatMap((f) => testFiles(path.join(root, f))).map((f) => path.relative(root, f)).sort();
if (!files.length) {
  console.error(`No *.test.ts files under ${folders.join(', ')}.`);
  process.exit(1);
}
const r = spawnSync('node', ['--import', 'tsx', '--test', '--test-concurrency=1', '--test-reporter=tap', ...files], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' },
});
process.exit(r.status ?? 1);

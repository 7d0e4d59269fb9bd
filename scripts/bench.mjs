// npm run bench: runs every bench/*.bench.ts in turn; each prints its own table of ratios against
// a floor measured in the same run. Benchmarks assert nothing; npm test never times anything.
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const only = process.argv.slice(2);
const files = readdirSync(path.join(root, 'bench'))
  .filter((f) => f.endsWith('.bench.ts') && (!only.length || only.some((o) => f.includes(o))))
  .sort();
let failed = 0;
for (const file of files) {
  console.log(`\n## ${file}\n`);
  const r = spawnSync('node', ['--import', 'tsx', path.join('bench', file)], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' },
  });
  if (r.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);

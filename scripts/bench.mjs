// npm run bench: runs every bench/*.bench.ts in turn (or those whose names contain an argument);
// each prints its own table against a floor measured in the same run, and reports its headline
// ratios (bench/ratio.ts), which are gathered into one table at the end. Benchmarks assert
// nothing; npm test never times anything.
import { spawn } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { ensureClientBuilt } from './client-build.mjs';

const RATIO_MARK = '::bench-ratio::';
const root = path.resolve(import.meta.dirname, '..');
const only = process.argv.slice(2);
const files = readdirSync(path.join(root, 'bench'))
  .filter((f) => f.endsWith('.bench.ts') && (!only.length || only.some((o) => f.includes(o))))
  .sort();

function run(file) {
  return new Promise((resolve) => {
    const child = spawn('node', ['--import', 'tsx', path.join('bench', file)], {
      cwd: root,
      stdio: ['ignore', 'pipe', 'inherit'],
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' },
    });
    const ratios = [];
    createInterface({ input: child.stdout }).on('line', (line) => {
      if (line.startsWith(RATIO_MARK)) ratios.push({ bench: file, ...JSON.parse(line.slice(RATIO_MARK.length)) });
      else console.log(line);
    });
    child.on('close', (code) => resolve({ code, ratios }));
  });
}

// The load benchmark runs the real server, which serves the built client.
if (files.includes('load.bench.ts')) ensureClientBuilt();

let failed = 0;
const all = [];
for (const file of files) {
  console.log(`\n## ${file}\n`);
  const { code, ratios } = await run(file);
  if (code !== 0) failed++;
  all.push(...ratios);
}
console.log('\n## Summary: each headline ratio against its floor, measured in the same run\n');
console.log('| benchmark | what | ratio | floor | aim |');
console.log('| --- | --- | ---: | --- | --- |');
for (const r of all) console.log(`| ${r.bench.replace('.bench.ts', '')} | ${r.what} | ${r.ratio.toFixed(2)}× | ${r.floor} | ${r.aim ?? '—'} |`);
process.exit(failed ? 1 : 0);

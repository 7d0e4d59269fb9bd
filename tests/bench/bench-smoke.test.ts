// Every benchmark of `npm run bench`, run at tiny sizes (BENCH_SMOKE=1) so that one that no longer
// runs is caught the day it breaks. Only that each ends cleanly and reports its headline ratio is
// checked: at these sizes the figures mean nothing, and npm test never times anything.
import assert from 'node:assert/strict';
import { spawn } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, test } from 'node:test';
import { RATIO_MARK } from '../../bench/ratio.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const benches = readdirSync(path.join(root, 'bench'))
  .filter((f) => f.endsWith('.bench.ts'))
  .sort();

/** Runs one benchmark as `npm run bench` does, in a smoke run; resolves with its exit code and output. */
function runBench(file: string): Promise<{ code: number | null; out: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join('bench', file)], {
      cwd: root,
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', BENCH_SMOKE: '1' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('close', (code) => resolve({ code, out }));
  });
}

describe('every benchmark runs to its ratio (smoke run, tiny sizes)', () => {
  test('should find the benchmarks', () => {
    assert.ok(benches.length >= 6, `benchmarks found: ${benches.join(', ')}`);
  });

  for (const file of benches) {
    test(`should run ${file} and report a finite ratio`, async () => {
      const { code, out } = await runBench(file);
      assert.equal(code, 0, `${file} exited with ${code}:\n${out.slice(-3000)}`);
      const ratios = out
        .split('\n')
        .filter((l) => l.startsWith(RATIO_MARK))
        .map((l) => JSON.parse(l.slice(RATIO_MARK.length)) as { what: string; ratio: number });
      assert.ok(ratios.length > 0, `${file} reported no ratio:\n${out.slice(-3000)}`);
      for (const r of ratios) assert.ok(Number.isFinite(r.ratio) && r.ratio > 0, `${file}: “${r.what}” is ${r.ratio}`);
    });
  }
});

// The initial client bundle (what the browser must fetch before the first screen: the scripts,
// module preloads and style sheets index.html names), gzip-compressed, against an empty Angular
// Material app — one component with a toolbar and a button, the router, HttpClient and a Material
// theme — built by the same @angular/build in the same run with the same optimisation settings.
// Lazy chunks are listed apart. Prints sizes and ratios; asserts nothing.
//   node --import tsx bench/bundle.bench.ts
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { reportRatio, SMOKE } from './ratio.js';

const root = path.resolve(import.meta.dirname, '..');
const ng = path.join(root, 'node_modules/@angular/cli/bin/ng.js');
const scratch = mkdtempSync(path.join(tmpdir(), 'hueledger-bundle-'));

function build(cwd: string, outputPath: string): void {
  const r = spawnSync(process.execPath, [ng, 'build', '--output-path', outputPath], { cwd, encoding: 'utf8', env: { ...process.env, NG_CLI_ANALYTICS: 'false' } });
  if (r.status !== 0) throw new Error(`ng build in ${cwd} failed:\n${r.stdout}\n${r.stderr}`);
}

interface Sizes {
  initial: { file: string; raw: number; gzip: number }[];
  lazy: { file: string; raw: number; gzip: number }[];
}

/** Initial files are the ones index.html loads; every other .js file is a lazy chunk. */
function sizesOf(browserDir: string): Sizes {
  const html = readFileSync(path.join(browserDir, 'index.html'), 'utf8');
  const named = new Set([...html.matchAll(/(?:src|href)="([^"]+\.(?:js|css))"/g)].map((m) => m[1]!));
  const measure = (file: string) => {
    const bytes = readFileSync(path.join(browserDir, file));
    return { file, raw: bytes.length, gzip: gzipSync(bytes, { level: 9 }).length };
  };
  const files = readdirSync(browserDir).filter((f) => /\.(js|css)$/.test(f) && statSync(path.join(browserDir, f)).isFile());
  return { initial: files.filter((f) => named.has(f)).map(measure), lazy: files.filter((f) => !named.has(f) && f.endsWith('.js')).map(measure) };
}

function writeBaseline(dir: string): void {
  const ours = JSON.parse(readFileSync(path.join(root, 'angular.json'), 'utf8'));
  // The empty app has no service worker (and no ngsw-config.json): leave that setting out.
  const { serviceWorker: _serviceWorker, ...production } = ours.projects.hueledger.architect.build.configurations.production;
  mkdirSync(path.join(dir, 'src'), { recursive: true });
  symlinkSync(path.join(root, 'node_modules'), path.join(dir, 'node_modules'), 'dir');
  writeFileSync(path.join(dir, 'package.json'), JSON.stringify({ name: 'baseline', private: true, type: 'module' }));
  writeFileSync(
    path.join(dir, 'angular.json'),
    JSON.stringify({
      version: 1,
      cli: { analytics: false },
      projects: {
        baseline: {
          projectType: 'application',
          root: '',
          sourceRoot: 'src',
          architect: {
            build: {
              builder: '@angular/build:application',
              options: { browser: 'src/main.ts', tsConfig: 'tsconfig.json', inlineStyleLanguage: 'scss', styles: ['src/styles.scss'] },
              configurations: { production: { ...production, budgets: [] } },
              defaultConfiguration: 'production',
            },
          },
        },
      },
    }),
  );
  const rootTs = JSON.parse(readFileSync(path.join(root, 'tsconfig.json'), 'utf8'));
  writeFileSync(path.join(dir, 'tsconfig.json'), JSON.stringify({ compilerOptions: { ...rootTs.compilerOptions, types: [] }, angularCompilerOptions: rootTs.angularCompilerOptions, files: ['src/main.ts'] }));
  writeFileSync(path.join(dir, 'src/index.html'), '<!doctype html><html><head><meta charset="utf-8"><title>Baseline</title><base href="/"></head><body><app-root></app-root></body></html>');
  writeFileSync(path.join(dir, 'src/styles.scss'), "@use '@angular/material' as mat;\nhtml { @include mat.theme((color: (primary: mat.$green-palette, theme-type: light), typography: Roboto, density: 0)); }\n");
  writeFileSync(
    path.join(dir, 'src/main.ts'),
    `import { Component, provideZonelessChangeDetection } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';
import { provideHttpClient } from '@angular/common/http';
import { provideRouter, RouterOutlet } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatToolbarModule } from '@angular/material/toolbar';

@Component({ selector: 'app-root', imports: [MatToolbarModule, MatButtonModule, RouterOutlet], template: '<mat-toolbar>Empty</mat-toolbar><button mat-flat-button>Button</button><router-outlet />' })
class App {}

bootstrapApplication(App, { providers: [provideZonelessChangeDetection(), provideRouter([]), provideHttpClient()] }).catch((e: unknown) => console.error(e));
`,
  );
}

try {
  const baselineDir = path.join(scratch, 'baseline');
  writeBaseline(baselineDir);
  build(baselineDir, path.join(scratch, 'baseline-out'));
  // A smoke run (npm test) measures the client npm test has just built instead of building it again.
  const built = path.join(root, 'dist/client/browser');
  const appDir = SMOKE && existsSync(path.join(built, 'index.html')) ? built : path.join(scratch, 'app-out/browser');
  if (appDir !== built) build(root, path.join(scratch, 'app-out'));
  const base = sizesOf(path.join(scratch, 'baseline-out/browser'));
  const app = sizesOf(appDir);
  const sum = (xs: { raw: number; gzip: number }[], k: 'raw' | 'gzip') => xs.reduce((s, x) => s + x[k], 0);
  const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;
  console.log('| build | initial files | initial raw | initial gzip | ratio (gzip) | lazy chunks | lazy gzip |');
  console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: |');
  console.log(`| empty Material app (floor) | ${base.initial.length} | ${kb(sum(base.initial, 'raw'))} | ${kb(sum(base.initial, 'gzip'))} | 1.00× | ${base.lazy.length} | ${kb(sum(base.lazy, 'gzip'))} |`);
  console.log(`| Hueledger | ${app.initial.length} | ${kb(sum(app.initial, 'raw'))} | ${kb(sum(app.initial, 'gzip'))} | ${(sum(app.initial, 'gzip') / sum(base.initial, 'gzip')).toFixed(2)}× | ${app.lazy.length} | ${kb(sum(app.lazy, 'gzip'))} |`);
  reportRatio('initial client download, gzip', sum(app.initial, 'gzip') / sum(base.initial, 'gzip'), 'an empty Angular Material app, same toolchain');
  console.log('\nLargest lazy chunks (gzip):');
  for (const c of [...app.lazy].sort((a, b) => b.gzip - a.gzip).slice(0, 8)) console.log(`  ${c.file.padEnd(28)} ${kb(c.gzip)}`);
} finally {
  rmSync(scratch, { recursive: true, force: true });
}

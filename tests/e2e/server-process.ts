import { spawn, type ChildProcess } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { sharedTemplate } from '../shared-template.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The real server (server/main.ts) in a child process, on a free port, with the demo scenario. */
export interface ServerProcess {
  url: string;
  dataDir: string;
  /** Everything the server printed so far. */
  output(): string;
  /** Stops the server (SIGTERM, then SIGKILL after 5 s) and removes the data folder unless it was given. */
  stop(): Promise<void>;
  /** Kills the server at once (SIGKILL), as a crash would; the data folder stays. */
  kill(): Promise<void>;
}

/** What a server process is started with. */
export interface ServerOptions {
  /** An existing data folder (kept on stop); a new temporary one by default (removed on stop). */
  dataDir?: string;
  env?: Record<string, string>;
  /** Whether the built client must exist (browser tests need it; API-only process tests do not). */
  needsClient?: boolean;
}

/** How long a server may take to answer /api/health after it was started. */
const START_LIMIT_MS = 180_000;

/** A TCP port nobody listens on right now, on loopback. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const addr = s.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      s.close(() => resolve(port));
    });
  });
}

/** Starts server/main.ts as a child process and waits until /api/health answers. */
export async function startServerProcess(opts: ServerOptions = {}): Promise<ServerProcess> {
  if (opts.needsClient && !existsSync(path.join(root, 'dist/client/browser/index.html'))) throw new Error('Build the client first: npm run build');
  const port = await freePort();
  const ownDir = opts.dataDir === undefined;
  const dataDir = opts.dataDir ?? mkdtempSync(path.join(tmpdir(), 'hueledger-e2e-'));
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', PORT: String(port), HUELEDGER_DATA_DIR: dataDir, HUELEDGER_DEMO: '1', ...opts.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const url = `http://localhost:${port}`;
  // Generous: on a loaded two-core machine compiling the server, migrating and seeding the demo
  // has taken over 30 s; a server that starts sooner is not waited for any longer.
  const deadline = Date.now() + START_LIMIT_MS;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${output}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`server did not start in ${START_LIMIT_MS / 1000} s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  const exited = () => (child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise<void>((r) => child.once('exit', () => r())));
  return {
    url,
    dataDir,
    output: () => output,
    async stop() {
      if (child.exitCode === null && child.signalCode === null) {
        const done = exited();
        child.kill('SIGTERM');
        // The timer is cleared once the server has gone: left running, it kept the test file's
        // process alive for 5 s after its last test.
        let timer: NodeJS.Timeout | undefined;
        await Promise.race([done, new Promise((r) => (timer = setTimeout(r, 5000)))]);
        clearTimeout(timer);
        if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
        await done;
      }
      if (ownDir) rmSync(dataDir, { recursive: true, force: true });
    },
    async kill() {
      const done = exited();
      child.kill('SIGKILL');
      await done;
    },
  };
}

/**
 * A data folder as the real server leaves it after its first start with the demo scenario, made once
 * per run and copied by every browser-test file (tests/shared-template.ts); null when there is none to share.
 */
function demoTemplate(): Promise<string | null> {
  return sharedTemplate(
    'e2e-demo',
    async (data) => {
      const server = await startServerProcess({ dataDir: data });
      await server.stop(); // a clean stop checkpoints SQLite's write-ahead log into the file
    },
    START_LIMIT_MS,
  );
}

/**
 * Fills `dataDir` with the run's seeded copy of the demo scenario when there is one; otherwise it
 * stays empty and the server migrates and seeds it on its first start, as it would anyway.
 */
export async function copyDemoTemplate(dataDir: string): Promise<void> {
  const template = await demoTemplate();
  if (template) cpSync(template, dataDir, { recursive: true });
}

/**
 * Starts the app with the demo scenario in a new data folder (from the run's seeded copy when there
 * is one), removed on stop. Browser tests need the built client (`npm run build`); `needsClient:
 * false` is for processes that only call the API (the load benchmark).
 */
export async function startServer(env: Record<string, string> = {}, { needsClient = true }: { needsClient?: boolean } = {}): Promise<ServerProcess> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'hueledger-e2e-'));
  await copyDemoTemplate(dataDir);
  const server = await startServerProcess({ env, needsClient, dataDir });
  return {
    ...server,
    async stop() {
      await server.stop();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

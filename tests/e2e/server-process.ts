import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The real server (server/main.ts) in a child process, on a free port, with a fresh data folder. */
export interface ServerProcess {
  url: string;
  dataDir: string;
  stop(): Promise<void>;
}

function freePort(): Promise<number> {
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

/** Starts the built app with the demo scenario; needs `npm run build` first. */
export async function startServer(env: Record<string, string> = {}): Promise<ServerProcess> {
  if (!existsSync(path.join(root, 'dist/client/browser/index.html'))) throw new Error('Build the client first: npm run build');
  const port = await freePort();
  const dataDir = mkdtempSync(path.join(tmpdir(), 'hueledger-e2e-'));
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', PORT: String(port), HUELEDGER_DATA_DIR: dataDir, HUELEDGER_DEMO: '1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const url = `http://localhost:${port}`;
  const deadline = Date.now() + 30_000;
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
      throw new Error(`server did not start in 30 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    url,
    dataDir,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null) child.kill('SIGKILL');
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

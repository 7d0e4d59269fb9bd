// A bounded load test on loopback: 50 signed-in recorders at once, each connection its own
// session, saving instrument readings and listing readings, against GET /api/health with the same
// 50 sessions in the same run (the floor: session lookup, CSRF cookie, JSON). The server is the
// real one (server/main.ts) in a child process with a fresh data folder and the demo scenario, so
// the load generator (autocannon) does not share its event loop. Prints throughput, p50 and p95
// and the ratios; asserts nothing.
//   node --import tsx bench/load.bench.ts [requests per phase]
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

const RECORDERS = 50;
const AMOUNT = Math.min(50_000, Number(process.argv[2] ?? 4000));
const root = path.resolve(import.meta.dirname, '..');
const DEMO_PASSWORD = 'demo-pass-2026';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      s.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
    });
  });
}

/** One signed-in browser: its cookie header and CSRF token. */
interface Session {
  cookie: string;
  csrf: string;
}

async function signIn(base: string, email: string, password: string): Promise<Session> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair!.indexOf('=');
      jar.set(pair!.slice(0, eq), pair!.slice(eq + 1));
    }
    return res;
  };
  const session = () => ({ cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '), csrf: decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') });
  keep(await fetch(`${base}/api/health`));
  const res = keep(await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { ...headers(session()), 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) }));
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status} ${await res.text()}`);
  return session();
}

function headers(s: Session): Record<string, string> {
  return { cookie: s.cookie, 'x-xsrf-token': s.csrf };
}

interface Phase {
  name: string;
  requests: number;
  errors: number;
  non2xx: number;
  throughput: number;
  p50: number;
  p95: number;
}

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))] ?? NaN;

/** Runs autocannon with one session per connection; latencies come from every response, for p95. */
async function phase(name: string, base: string, sessions: Session[], requests: autocannon.Request[]): Promise<Phase> {
  let next = 0;
  const latencies: number[] = [];
  let instance!: autocannon.Instance;
  const started = performance.now();
  const done = new Promise<autocannon.Result>((resolve, reject) => {
    instance = autocannon({
    url: base,
    connections: sessions.length,
    amount: AMOUNT,
    initialContext: {},
    requests: requests.map(
      (r): autocannon.Request => ({
        ...r,
        // The request's own set-up (a fresh body) first, then this connection's session.
        setupRequest: ((req: autocannon.Request, context: Record<string, unknown>) => {
          const own = r.setupRequest ? (r.setupRequest as (q: autocannon.Request, c: object) => autocannon.Request)(req, context) : req;
          if (context['session'] === undefined) context['session'] = next++ % sessions.length;
          const s = sessions[context['session'] as number]!;
          return { ...own, headers: { ...own.headers, ...headers(s) } };
        }) as autocannon.Request['setupRequest'],
      }),
    ),
  }, (err, result) => (err ? reject(err) : resolve(result)));
  });
  instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => latencies.push(ms));
  const result = await done;
  const seconds = (performance.now() - started) / 1000;
  return {
    name,
    requests: result.requests.total,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
    throughput: result.requests.total / seconds,
    p50: quantile(latencies, 0.5),
    p95: quantile(latencies, 0.95),
  };
}

const port = await freePort();
const dataDir = mkdtempSync(path.join(tmpdir(), 'hueledger-load-'));
const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
  cwd: root,
  env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', PORT: String(port), HUELEDGER_DATA_DIR: dataDir, HUELEDGER_DEMO: '1' },
  stdio: ['ignore', 'pipe', 'inherit'],
});
try {
  await new Promise<void>((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => d.toString().includes('Hueledger on') && resolve());
    child.once('exit', (code) => reject(new Error(`server exited ${code}`)));
  });
  const base = `http://127.0.0.1:${port}`;
  const admin = await signIn(base, 'admin@demo.test', DEMO_PASSWORD);
  const json = (s: Session) => ({ ...headers(s), 'content-type': 'application/json' });
  const emails = Array.from({ length: RECORDERS }, (_, i) => `load-recorder-${i}@load.test`);
  for (const email of emails) {
    const res = await fetch(`${base}/api/users`, { method: 'POST', headers: json(admin), body: JSON.stringify({ email, name: `Load recorder ${email.slice(14, 16)}`, role: 'recorder', password: DEMO_PASSWORD }) });
    if (res.status !== 201) throw new Error(`creating ${email}: ${res.status} ${await res.text()}`);
  }
  const sessions = await Promise.all(emails.map((e) => signIn(base, e, DEMO_PASSWORD)));
  const accessions = (await (await fetch(`${base}/api/accessions`, { headers: headers(admin) })).json()) as { id: number }[];
  const characters = ((await (await fetch(`${base}/api/characters`, { headers: headers(admin) })).json()) as { id: number; colour: boolean; active: boolean }[]).filter((c) => c.colour && c.active);
  const reading = (i: number) =>
    JSON.stringify({ method: 'instrument', accessionId: accessions[i % accessions.length]!.id, characterId: characters[i % characters.length]!.id, light: 'open-shade', lab: [40 + (i % 30), 20 - (i % 40), (i % 50) - 25] });

  const floor = await phase('GET /api/health', base, sessions, [{ method: 'GET', path: '/api/health' }]);
  let n = 0;
  const work = await phase('POST /api/readings + GET /api/readings', base, sessions, [
    { method: 'POST', path: '/api/readings', headers: { 'content-type': 'application/json' }, setupRequest: ((req: autocannon.Request) => ({ ...req, body: reading(n++) })) as autocannon.Request['setupRequest'] },
    { method: 'GET', path: '/api/readings?pageSize=20&sort=observedAt&dir=desc' },
  ]);
  const ms = (x: number) => `${x.toFixed(1)} ms`;
  console.log(`${RECORDERS} signed-in recorders at once, ${AMOUNT} requests per phase, loopback, real server process`);
  console.log('| phase | requests | errors | non-2xx | req/s | p50 | p95 |');
  console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: |');
  for (const p of [floor, work]) console.log(`| ${p.name} | ${p.requests} | ${p.errors} | ${p.non2xx} | ${p.throughput.toFixed(0)} | ${ms(p.p50)} | ${ms(p.p95)} |`);
  console.log(`\nthroughput, health / readings: ${(floor.throughput / work.throughput).toFixed(2)}×`);
  console.log(`p50, readings / health: ${(work.p50 / floor.p50).toFixed(2)}×   p95: ${(work.p95 / floor.p95).toFixed(2)}×`);
  if (work.errors || work.non2xx || floor.errors || floor.non2xx) {
    console.log('\nSome requests failed: see the counts above.');
    process.exitCode = 1;
  }
} finally {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
  rmSync(dataDir, { recursive: true, force: true });
}

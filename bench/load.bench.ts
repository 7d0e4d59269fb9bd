// A bounded load test on loopback: 50 signed-in recorders at once, each connection its own
// session, saving instrument readings and listing readings, against GET /api/health with the same
// 50 sessions in the same run (the floor: session lookup, CSRF cookie, JSON). The server is the
// real one (server/main.ts) in a child process with a fresh data folder and the demo scenario (in
// npm test's smoke run, a copy of that run's seeded folder), so the load generator (autocannon)
// does not share its event loop. Prints throughput, p50 and p95 and the ratios; asserts nothing.
//   node --import tsx bench/load.bench.ts [requests per phase]
import autocannon from 'autocannon';
import { signInOverHttp, type HttpSession } from '../tests/e2e/http-session.js';
import { startServer } from '../tests/e2e/server-process.js';
import { benchSize, reportRatio, SMOKE } from './ratio.js';

const RECORDERS = SMOKE ? 4 : 50;
const AMOUNT = Math.min(50_000, benchSize(4000, 100));
const DEMO_PASSWORD = 'demo-pass-2026';

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
async function phase(name: string, base: string, sessions: HttpSession[], requests: autocannon.Request[]): Promise<Phase> {
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
          return { ...own, headers: { ...own.headers, ...s.headers() } };
        }) as autocannon.Request['setupRequest'],
      }),
    ),
  }, (err, result) => (err ? reject(err) : resolve(result)));
  });
  let last = started;
  // autocannon finishes on its one-second tick; the last response's time is the real end of the work.
  instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => {
    latencies.push(ms);
    last = performance.now();
  });
  const result = await done;
  const seconds = (last - started) / 1000;
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

const server = await startServer({}, { needsClient: false });
try {
  const base = server.url;
  const admin = await signInOverHttp(base, 'admin@demo.test', DEMO_PASSWORD);
  const emails = Array.from({ length: RECORDERS }, (_, i) => `load-recorder-${i}@load.test`);
  for (const email of emails) {
    const res = await fetch(`${base}/api/users`, { method: 'POST', headers: admin.json(), body: JSON.stringify({ email, name: `Load recorder ${email.slice(14, 16)}`, role: 'recorder', password: DEMO_PASSWORD }) });
    if (res.status !== 201) throw new Error(`creating ${email}: ${res.status} ${await res.text()}`);
  }
  const sessions = await Promise.all(emails.map((e) => signInOverHttp(base, e, DEMO_PASSWORD)));
  const accessions = (await (await fetch(`${base}/api/accessions`, { headers: admin.headers() })).json()) as { id: number }[];
  const characters = ((await (await fetch(`${base}/api/characters`, { headers: admin.headers() })).json()) as { id: number; colour: boolean; active: boolean }[]).filter((c) => c.colour && c.active);
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
  reportRatio(`load, ${RECORDERS} recorders: throughput`, floor.throughput / work.throughput, 'GET /api/health, same sessions (health req/s ÷ readings req/s)');
  reportRatio(`load, ${RECORDERS} recorders: p95 latency`, work.p95 / floor.p95, 'GET /api/health, same sessions');
  if (work.errors || work.non2xx || floor.errors || floor.non2xx) {
    console.log('\nSome requests failed: see the counts above.');
    process.exitCode = 1;
  }
} finally {
  await server.stop();
}

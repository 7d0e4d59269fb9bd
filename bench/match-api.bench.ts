// /api/match against the /api/health round trip, both over loopback HTTP to the same app in the
// same run (sessions, CSRF and JSON included on both), for each reference set, with each set's chip
// count and the size of its chips answer (gzip, as a browser fetches it). Prints medians, p95 and
// the ratios; asserts nothing.
//   TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx bench/match-api.bench.ts [requests]
import type { AddressInfo } from 'node:net';
import { formatHex } from 'culori';
import { addUser, PASSWORD, startHarness } from '../tests/api/harness.js';
import { mulberry32 } from '../shared/random/mulberry32.js';
import { benchSize, reportRatio, SMOKE } from './ratio.js';

const REQUESTS = Math.min(5000, benchSize(1000, 30));
const WARM_UP = SMOKE ? 5 : 100;

const h = await startHarness();
const server = h.app.listen(0, '127.0.0.1');
await new Promise((resolve) => server.once('listening', resolve));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

/** Cookies as a browser keeps them, name → value. */
const jar = new Map<string, string>();
function keep(res: Response): Response {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(';');
    const eq = pair!.indexOf('=');
    jar.set(pair!.slice(0, eq), pair!.slice(eq + 1));
  }
  return res;
}
function headers(): Record<string, string> {
  return {
    cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '),
    'x-xsrf-token': decodeURIComponent(jar.get('XSRF-TOKEN') ?? ''),
    'content-type': 'application/json',
  };
}

await addUser(h.ds, 'recorder', 'bench@test.example');
keep(await fetch(`${base}/api/health`));
const login = keep(await fetch(`${base}/api/auth/login`, { method: 'POST', headers: headers(), body: JSON.stringify({ email: 'bench@test.example', password: PASSWORD }) }));
if (!login.ok) throw new Error(`sign-in failed: ${login.status}`);

const random = mulberry32(0x4150494d);
const colours = Array.from({ length: REQUESTS + WARM_UP }, () => formatHex({ mode: 'rgb', r: random(), g: random(), b: random() }));

async function health(): Promise<void> {
  const res = await fetch(`${base}/api/health`, { headers: headers() });
  if (!res.ok) throw new Error(`health ${res.status}`);
  await res.arrayBuffer();
}
async function match(i: number, setId: string): Promise<void> {
  const res = await fetch(`${base}/api/match`, { method: 'POST', headers: headers(), body: JSON.stringify({ hex: colours[i], k: 5, setId }) });
  if (!res.ok) throw new Error(`match ${res.status}: ${await res.text()}`);
  await res.arrayBuffer();
}

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))]!;
const ms = (x: number) => `${x.toFixed(3)} ms`;
const sets = (await (await fetch(`${base}/api/reference-sets`, { headers: headers() })).json()) as { id: string; fieldChips: number; fineChips: number }[];
const gzipBytes: Record<string, number> = {};

for (const set of [...sets].reverse()) {
  const chips = await fetch(`${base}/api/reference-sets/${set.id}/chips`, { headers: { ...headers(), 'accept-encoding': 'gzip' } });
  gzipBytes[set.id] = Number(chips.headers.get('content-length'));
  await chips.arrayBuffer();
  // Warm up both paths (JIT, the set's index built on first match), then alternate so drift hits both alike.
  for (let i = 0; i < WARM_UP; i++) {
    await health();
    await match(REQUESTS + i, set.id);
  }
  const times = { health: [] as number[], match: [] as number[] };
  for (let i = 0; i < REQUESTS; i++) {
    let t = performance.now();
    await health();
    times.health.push(performance.now() - t);
    t = performance.now();
    await match(i, set.id);
    times.match.push(performance.now() - t);
  }
  const chipCount = set.fieldChips + set.fineChips;
  console.log(`\nset ${set.id}: ${chipCount.toLocaleString('en')} chips (${set.fieldChips} field); chips answer ${(gzipBytes[set.id]! / 1024).toFixed(0)} KiB gzip`);
  console.log(`${REQUESTS} requests each over loopback, alternating, after ${WARM_UP} to warm up`);
  console.log('| route | median | p95 |');
  console.log('|---|---|---|');
  console.log(`| GET /api/health | ${ms(quantile(times.health, 0.5))} | ${ms(quantile(times.health, 0.95))} |`);
  console.log(`| POST /api/match (k = 5, set ${set.id}) | ${ms(quantile(times.match, 0.5))} | ${ms(quantile(times.match, 0.95))} |`);
  console.log(`match / health, medians: ${(quantile(times.match, 0.5) / quantile(times.health, 0.5)).toFixed(2)}× (aim ≤ 2×)`);
  console.log(`match / health, p95:     ${(quantile(times.match, 0.95) / quantile(times.health, 0.95)).toFixed(2)}×`);
  reportRatio(`POST /api/match, set ${set.id} (${chipCount} chips), median`, quantile(times.match, 0.5) / quantile(times.health, 0.5), 'GET /api/health', '≤ 2×');
}
if (gzipBytes['v1'] && gzipBytes['v2']) {
  reportRatio('chips answer gzip, v2 against v1', gzipBytes['v2'] / gzipBytes['v1'], `set v1's ${(gzipBytes['v1'] / 1024).toFixed(0)} KiB`);
}

await new Promise((resolve) => server.close(resolve));
await h.close();

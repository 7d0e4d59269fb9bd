// 1,000 seeded random corrections and reviews against a model kept in the test: afterwards every
// reading's links, status, versions and audit history are exactly what the model says, and no
// reading was lost (readings are never deleted or edited in place; only the review status moves).
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { mulberry32 } from '../../shared/random/mulberry32.js';
import type { ReadingDetail, ReadingStatus } from '../../shared/api/reading-answers.js';
import type { ReviewDecision } from '../../shared/api/review-answers.js';
import { Client, signedInAs, startHarness, type Harness } from './harness.js';

const OPERATIONS = Number(process.env['HISTORY_OPERATIONS'] ?? 1000);
const SEED = 0x48495354;
const STATUS_AFTER: Record<ReviewDecision, ReadingStatus> = { approve: 'approved', flag: 'flagged', reread: 'reread-requested' };

interface Modelled {
  id: number;
  owner: 'recorder' | 'other';
  supersedes: number | null;
  supersededBy: number | null;
  status: ReadingStatus;
  /** The audit actions expected with this reading as subject, in order. */
  events: string[];
}

let h: Harness;
let who: Record<'recorder' | 'other' | 'reviewer' | 'admin', Client>;
let accessionId: number;
let characterId: number;

before(async () => {
  h = await startHarness({ demo: true, logError: (e) => console.error('server error:', e) });
  const [recorder, other, reviewer, admin] = await Promise.all([signedInAs(h, 'recorder'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer'), signedInAs(h, 'admin')]);
  who = { recorder: recorder!, other: other!, reviewer: reviewer!, admin: admin! };
  accessionId = ((await admin!.get('/api/accessions').expect(200)).body[0] as { id: number }).id;
  characterId = ((await admin!.get('/api/characters').expect(200)).body as { id: number; colour: boolean; active: boolean }[]).find((c) => c.colour && c.active)!.id;
});
after(() => h.close());

const body = (n: number) => ({ method: 'instrument', accessionId, characterId, light: 'overcast', lab: [30 + (n % 60), (n % 41) - 20, (n % 37) - 18] });

test(`${OPERATIONS} random corrections and reviews keep every reading's full history`, async () => {
  const random = mulberry32(SEED);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;
  const model = new Map<number, Modelled>();
  const countReadings = async () => Number(((await h.ds.query('SELECT COUNT(*) AS n FROM reading')) as { n: number }[])[0]!.n);
  const demoReadings = await countReadings();
  const create = async (owner: 'recorder' | 'other', n: number) => {
    const res = await who[owner].post('/api/readings', body(n));
    assert.equal(res.status, 201, res.text);
    model.set(res.body.id, { id: res.body.id, owner, supersedes: null, supersededBy: null, status: 'submitted', events: ['reading.created'] });
  };
  for (let i = 0; i < 12; i++) await create(i % 3 === 0 ? 'other' : 'recorder', i);

  const tally = { superseded: 0, reviewed: 0, refused: 0 };
  for (let i = 0; i < OPERATIONS; i++) {
    const r = model.get(pick([...model.keys()]))!;
    const current = r.supersededBy === null;
    const op = pick(['supersede-own', 'supersede-own', 'supersede-admin', 'supersede-not-own', 'review', 'review', 'review', 'create']);
    if (op === 'create') {
      await create(pick(['recorder', 'other'] as const), i);
      continue;
    }
    if (op === 'review') {
      const decision = pick(['approve', 'flag', 'reread'] as const);
      const res = await who.reviewer.post(`/api/readings/${r.id}/review`, { decision, comment: decision === 'approve' ? null : `check ${i}` });
      if (!current) {
        assert.equal(res.status, 409, `reviewing superseded ${r.id}: ${res.text}`);
        tally.refused++;
        continue;
      }
      assert.equal(res.status, 201, res.text);
      r.status = STATUS_AFTER[decision];
      r.events.push('reading.reviewed');
      tally.reviewed++;
      continue;
    }
    const as = op === 'supersede-admin' ? 'admin' : op === 'supersede-own' ? r.owner : r.owner === 'recorder' ? 'other' : 'recorder';
    const res = await who[as].post(`/api/readings/${r.id}/supersede`, { ...body(i), reason: `correction ${i}` });
    if (op === 'supersede-not-own') {
      // Refused either way; for a superseded reading the server may name that first (409) rather than the owner (403).
      if (current) assert.equal(res.status, 403, `another recorder correcting ${r.id}: ${res.text}`);
      else assert.ok([403, 409].includes(res.status), `another recorder correcting superseded ${r.id}: ${res.status} ${res.text}`);
      tally.refused++;
      continue;
    }
    if (!current) {
      assert.equal(res.status, 409, `correcting superseded ${r.id}: ${res.text}`);
      tally.refused++;
      continue;
    }
    assert.equal(res.status, 201, res.text);
    // A correction keeps the reading's observer (who looked at the plant), also when an admin made it.
    const next: Modelled = { id: res.body.id, owner: r.owner, supersedes: r.id, supersededBy: null, status: 'submitted', events: ['reading.created'] };
    r.supersededBy = next.id;
    r.events.push('reading.superseded');
    model.set(next.id, next);
    tally.superseded++;
  }
  assert.ok(tally.superseded > 100 && tally.reviewed > 100 && tally.refused > 50, JSON.stringify(tally));

  assert.equal(await countReadings(), demoReadings + model.size, 'every reading ever created is still there');
  for (const r of model.values()) {
    const d = (await who.admin.get(`/api/readings/${r.id}`).expect(200)).body as ReadingDetail;
    assert.equal(d.supersedesId, r.supersedes, `reading ${r.id} supersedes`);
    assert.equal(d.supersededById, r.supersededBy, `reading ${r.id} superseded by`);
    assert.equal(d.status, r.status, `reading ${r.id} status`);
    assert.deepEqual(d.history.map((e) => e.action), r.events, `reading ${r.id} history`);
    // The chain, walked in the model from this reading to both ends.
    const chain: number[] = [r.id];
    for (let back = r.supersedes; back !== null; back = model.get(back)!.supersedes) chain.unshift(back);
    for (let ahead = r.supersededBy; ahead !== null; ahead = model.get(ahead)!.supersededBy) chain.push(ahead);
    assert.deepEqual(d.versions.map((v) => v.id), chain, `reading ${r.id} versions`);
    assert.deepEqual(d.versions.filter((v) => v.current).map((v) => v.id), [chain.at(-1)], `reading ${r.id}: one current version`);
  }
});

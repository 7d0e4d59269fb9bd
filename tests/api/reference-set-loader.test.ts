import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { ReferenceSetSummary } from '../../shared/api/reference-set-answers.js';
import { loadReferenceSets } from '../../server/reference-sets/load-reference-sets.js';
import { Chip, ReferenceSet } from '../../server/reference-sets/reference-set.entity.js';
import { rowCounts, signedInAs, startHarness, type Harness } from './harness.js';
import { readSetV1 } from './reference-set-file.js';

/** Every stored chip of a set as comparable text, in code order. */
async function storedChips(h: Harness, setId: string): Promise<string> {
  const rows = await h.ds.getRepository(Chip).find({ where: { setId }, order: { code: 'ASC' } });
  return JSON.stringify(rows.map(({ code, parent, name, l, a, b, hex, inGamut, kind }) => [code, parent, name, l, a, b, hex, inGamut, kind]));
}

describe('loading reference sets from reference-colors/', () => {
  let h: Harness;
  let scratch: string;
  const quiet = { log: () => {} };

  before(async () => {
    // The harness has already loaded the committed folder once, as the server does at start-up.
    h = await startHarness();
    scratch = mkdtempSync(path.join(tmpdir(), 'hueledger-sets-'));
  });
  after(async () => {
    await h.close();
    rmSync(scratch, { recursive: true, force: true });
  });

  function writeSet(name: string, content: object): void {
    writeFileSync(path.join(scratch, name), JSON.stringify(content));
  }

  test('should add nothing when run again over the same files', async () => {
    const before = await rowCounts(h.ds);
    const warnings: string[] = [];
    const report = await loadReferenceSets(h.ds, { ...quiet, warn: (m) => warnings.push(m) });
    assert.deepEqual(report.added, []);
    assert.deepEqual(report.unchanged, ['v1', 'v2']);
    assert.deepEqual(warnings, []);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should record the file hash and an audit event for the set it loaded', async () => {
    const sets = await h.ds.getRepository(ReferenceSet).find();
    assert.ok(sets.every((set) => /^[0-9a-f]{64}$/.test(set.fileSha256)));
    const events = await h.ds.query(`SELECT subject FROM audit_event WHERE action = 'reference-set.loaded' ORDER BY id`);
    assert.deepEqual(events, [{ subject: 'v1' }, { subject: 'v2' }]);
  });

  test('should never rewrite a stored set when its file changes: the stored chips stay, with a warning', async () => {
    const changed = readSetV1();
    changed.chips[0]!.lab = [10, 10, 10];
    changed.chips[0]!.name = 'renamed on purpose';
    changed.chips.pop();
    writeSet('reference-set-v1.json', changed);
    const chipsBefore = await storedChips(h, 'v1');
    const [setBefore] = await h.ds.getRepository(ReferenceSet).findBy({ id: 'v1' });
    const warnings: string[] = [];

    const report = await loadReferenceSets(h.ds, { ...quiet, dir: scratch, warn: (m) => warnings.push(m) });

    assert.deepEqual(report.kept, ['v1']);
    assert.deepEqual(report.added, []);
    assert.equal(warnings.length, 1);
    assert.match(warnings[0]!, /v1.*differs.*Keeping the stored set/);
    assert.equal(await storedChips(h, 'v1'), chipsBefore);
    assert.deepEqual(await h.ds.getRepository(ReferenceSet).findBy({ id: 'v1' }), [setBefore]);
    rmSync(path.join(scratch, 'reference-set-v1.json'));
  });

  test('should add a new version as a new set beside the old ones, current once an admin chooses it', async () => {
    const v1 = readSetV1();
    const field = v1.chips.filter((c) => c.parent === null).slice(0, 3);
    const fine = v1.chips.filter((c) => c.parent === field[0]!.code).slice(0, 2);
    writeSet('reference-set-v3test.json', { ...v1, id: 'v3test', version: 3, name: 'A test set, version 3', chips: [field[0], ...fine, field[1], field[2]] });
    const v1Before = await storedChips(h, 'v1');

    const report = await loadReferenceSets(h.ds, { ...quiet, dir: scratch });

    assert.deepEqual(report.added, ['v3test']);
    assert.equal(await h.ds.getRepository(Chip).countBy({ setId: 'v3test' }), 5);
    assert.equal(await storedChips(h, 'v1'), v1Before);
    const recorder = await signedInAs(h, 'recorder');
    const listed = async () => ((await recorder.get('/api/reference-sets').expect(200)).body as ReferenceSetSummary[]).map((s) => [s.id, s.current, s.fieldChips, s.fineChips]);
    const v2 = await h.ds.getRepository(Chip).countBy({ setId: 'v2', kind: 'field' });
    const v2Fine = await h.ds.getRepository(Chip).countBy({ setId: 'v2', kind: 'fine' });
    // A new file does not change matching by itself: v1 stays current until an admin chooses.
    assert.deepEqual(await listed(), [['v3test', false, 3, 2], ['v2', false, v2, v2Fine], ['v1', true, 189, 11530]]);
    await (await signedInAs(h, 'admin')).put('/api/reference-sets/current', { setId: 'v3test' }).expect(200);
    assert.deepEqual(await listed(), [['v3test', true, 3, 2], ['v2', false, v2, v2Fine], ['v1', false, 189, 11530]]);
    const answer = (await recorder.post('/api/match', { lab: fine[0]!.lab }).expect(200)).body as { setId: string; matches: { code: string }[] };
    assert.equal(answer.setId, 'v3test', 'matching uses the current set');
    assert.equal(answer.matches[0]!.code, fine[0]!.code);
    assert.equal(answer.matches.length, 5);
    const againstV1 = (await recorder.post('/api/match', { lab: fine[0]!.lab, setId: 'v1' }).expect(200)).body as { setId: string };
    assert.equal(againstV1.setId, 'v1');
  });

  test('should refuse a file whose version another set already has, with a warning', async () => {
    const v1 = readSetV1();
    writeSet('reference-set-clash.json', { ...v1, id: 'clash', chips: v1.chips.slice(0, 1) });
    const warnings: string[] = [];
    const report = await loadReferenceSets(h.ds, { ...quiet, dir: scratch, warn: (m) => warnings.push(m) });
    assert.deepEqual(report.kept, ['clash']);
    assert.match(warnings.join('\n'), /clash.*version 1 already belongs to set v1/);
    assert.equal(await h.ds.getRepository(ReferenceSet).countBy({ id: 'clash' }), 0);
    rmSync(path.join(scratch, 'reference-set-clash.json'));
  });

  test('should stop with a message naming the file when a file is not a reference set', async () => {
    const v1 = readSetV1();
    writeSet('reference-set-broken.json', { ...v1, id: 'broken', version: 7, chips: [{ ...v1.chips[1], parent: 'F-999' }] });
    await assert.rejects(loadReferenceSets(h.ds, { ...quiet, dir: scratch }), /reference-set-broken\.json.*F-001\.001/);
    assert.equal(await h.ds.getRepository(ReferenceSet).countBy({ id: 'broken' }), 0);
    rmSync(path.join(scratch, 'reference-set-broken.json'));
  });
});

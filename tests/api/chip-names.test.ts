import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { ReadingDetail, ReadingList } from '../../shared/api/reading-answers.js';
import { chipName } from '../../shared/colour/chip-name.js';
import { Chip } from '../../server/reference-sets/reference-set.entity.js';
import { Reading } from '../../server/readings/reading.entity.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { readSetV1 } from './reference-set-file.js';

// A chip's name is derived data (reference-colors/README.md): readings stored with v1's wording
// show today's names in lists, details and exports, and the stored rows stay as they were.

const OLD_WORDS = /very pale|greyish|moderate|strong|vivid|deep|yellow-orange|yellow-green|blue-green|red-purple/;

describe("readings show their best chip's name as derived today", () => {
  let h: Harness;
  let admin: Client;

  before(async () => {
    h = await startHarness({ demo: true });
    admin = await signedInAs(h, 'admin');
  });
  after(() => h.close());

  before(async () => {
    // Readings stored before the new wording carry v1's stored name; give every demo reading the
    // name its chip has in the v1 file, as such a database holds.
    const file = readSetV1();
    const stored = new Map(file.chips.map((c) => [c.code, c.name]));
    for (const r of await h.ds.getRepository(Reading).find({ select: { id: true, setId: true, bestChipCode: true } })) {
      if (r.setId === 'v1') await h.ds.query('UPDATE reading SET bestChipName = ? WHERE id = ?', [stored.get(r.bestChipCode), r.id]);
    }
    const names = await h.ds.getRepository(Reading).find({ select: { id: true, bestChipName: true } });
    assert.ok(names.some((r) => OLD_WORDS.test(r.bestChipName)), 'expected stored names in the old wording');
  });

  test('the list, the detail and both exports name chips in the new wording, derived from the chip', async () => {
    const list = (await admin.get('/api/readings?page=1&pageSize=100').expect(200)).body as ReadingList;
    assert.ok(list.items.length > 0);
    for (const r of list.items) {
      assert.doesNotMatch(r.bestChipName, OLD_WORDS, `reading ${r.id}`);
      const chip = await h.ds.getRepository(Chip).findOneByOrFail({ setId: r.setId, code: r.bestChip });
      const parent = chip.parent === null ? null : await h.ds.getRepository(Chip).findOneByOrFail({ setId: r.setId, code: chip.parent });
      assert.equal(r.bestChipName, chipName({ l: chip.l, a: chip.a, b: chip.b }, parent && { l: parent.l, a: parent.a, b: parent.b }));
    }
    const detail = (await admin.get(`/api/readings/${list.items[0]!.id}`).expect(200)).body as ReadingDetail;
    assert.equal(detail.bestChipName, list.items[0]!.bestChipName);
    assert.ok(detail.matches.every((m) => !OLD_WORDS.test(m.name)));
    // The detail also matches the colour against the other set (v2 for a v1 reading), marked current or not.
    assert.equal(detail.setId, 'v1');
    assert.deepEqual(detail.otherSets.map((o) => [o.setId, o.current, o.matches.length]), [['v2', false, 5]]);
    assert.ok(detail.otherSets[0]!.matches.every((m) => Number(m.code.slice(2, 5)) > 189), 'v2 codes');
    const lab = { l: detail.lab[0], a: detail.lab[1], b: detail.lab[2] };
    const v2Best = (await admin.post('/api/match', { lab: detail.lab, setId: 'v2', k: 1 }).expect(200)).body.matches[0];
    assert.equal(detail.otherSets[0]!.matches[0]!.code, v2Best.code, `v2 best for ${JSON.stringify(lab)}`);
    const csv = (await admin.get('/api/readings/export.csv').expect(200)).text;
    assert.doesNotMatch(csv, OLD_WORDS);
    const stored = await h.ds.getRepository(Reading).find({ select: { id: true, bestChipName: true } });
    assert.ok(stored.some((r) => OLD_WORDS.test(r.bestChipName)), 'the stored rows are never rewritten');
  });
});

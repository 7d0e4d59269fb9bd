// The ground and the stripe colour of one photo region saved as two readings in one step
// (POST /api/readings/batch), all or nothing. A synthetic striped photo whose two colours are
// known: truths computed with culori from the sRGB values written (IEC 61966-2-1 sRGB, CIELAB
// D65), nearest chips from the same exact search the Match page runs.
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { parse as parseCsv } from 'csv-parse/sync';
import { after, before, describe, test } from 'node:test';
import type { PhotoDto, PhotoSample } from '../../shared/api/photo-answers.js';
import type { CreatedReadings, CreateReadingRequest, ReadingDetail } from '../../shared/api/reading-answers.js';
import type { MatchAnswer } from '../../shared/api/reference-set-answers.js';
import { IDEMPOTENCY_HEADER, REPLAYED_HEADER } from '../../shared/api/idempotency.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import type { Region } from '../../shared/photo/region.js';
import { assertInvalidFields } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { fromRaw, hexToRgb8, labOfRgb8, stripedPixels, uploadPhoto, type Rgb8 } from './photo-fixtures.js';
import { readingWorld, type ReadingWorld } from './reading-fixtures.js';

/** Invented tissue colours: a leaf-green petiole ground with purple stripes, 3 : 1. */
const GROUND = hexToRgb8('#4f7a28');
const STRIPE = hexToRgb8('#6b2d5c');
const WIDTH = 400;
const HEIGHT = 200;
/** Whole periods of the 40 px pattern, clear of the image edge. */
const REGION: Region = { shape: 'rect', x: 0, y: 20, width: 400, height: 160 };

describe('POST /api/readings/batch: the colours of one region as readings of their characters', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let w: ReadingWorld;
  let striped: PhotoDto;
  let flat: PhotoDto;

  before(async () => {
    h = await startHarness();
    [admin, recorder] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder')]);
    w = await readingWorld(admin);
    const png = async (pattern: { rgb: Rgb8; width: number }[]) => fromRaw(stripedPixels(WIDTH, HEIGHT, pattern), WIDTH, HEIGHT).png().toBuffer();
    striped = (await uploadPhoto(recorder, await png([{ rgb: GROUND, width: 30 }, { rgb: STRIPE, width: 10 }]), 'striped.png', 'image/png').expect(201)).body as PhotoDto;
    flat = (await uploadPhoto(recorder, await png([{ rgb: GROUND, width: 40 }]), 'flat.png', 'image/png').expect(201)).body as PhotoDto;
  });
  after(() => h.close());

  const character = (code: string) => w.characters.get(code)!.id;
  const colourOf = (photo: PhotoDto, characterCode: string, cluster: number, over: Partial<CreateReadingRequest> = {}): CreateReadingRequest => ({
    accessionId: w.violet.id,
    plantId: w.violet.plants[0]!.id,
    characterId: character(characterCode),
    observedAt: '2026-02-10T09:30:00+12:00',
    method: 'photo',
    photo: { photoId: photo.id, region: REGION, cluster },
    light: 'open-shade',
    ...over,
  });
  const nearestChip = async (rgb: Rgb8) => {
    const lab = labOfRgb8(rgb);
    return ((await recorder.post('/api/match', { lab: [lab.l, lab.a, lab.b], k: 1 }).expect(200)).body as MatchAnswer).matches[0]!.code;
  };
  /** Every table's row count but the sessions', which signing in changes. */
  const counts = async () => {
    const { session: _session, ...rest } = await rowCounts(h.ds);
    return rest;
  };

  test('should save the ground and the stripe as two readings whose colours are the two painted, not their mean', async () => {
    const sample = (await recorder.post(`/api/photos/${striped.id}/sample`, { region: REGION }).expect(200)).body as PhotoSample;
    assert.equal(sample.clusters.length, 2, 'the photo page lists two colours');
    const res = await recorder.post('/api/readings/batch', { readings: [colourOf(striped, 'petiole.third.middle', 0), colourOf(striped, 'petiole.stripes', 1)] });
    assert.equal(res.status, 201, res.text);
    const [ground, stripe] = (res.body as CreatedReadings).readings;
    assert.deepEqual([ground!.characterCode, stripe!.characterCode], ['petiole.third.middle', 'petiole.stripes']);
    assert.ok(deltaE00(labFromTuple(ground!.lab), labOfRgb8(GROUND)) < 0.5, `ground ${ground!.lab}`);
    assert.ok(deltaE00(labFromTuple(stripe!.lab), labOfRgb8(STRIPE)) < 0.5, `stripe ${stripe!.lab}`);
    // The region's mean lies far from both: neither reading took it.
    for (const r of [ground!, stripe!]) assert.ok(deltaE00(labFromTuple(r.lab), labFromTuple(sample.lab)) > 5);
    assert.equal(ground!.bestChip, await nearestChip(GROUND));
    assert.equal(stripe!.bestChip, await nearestChip(STRIPE));
    // Provenance says which colour of the region each reading is, and how much of it.
    const detail = (await recorder.get(`/api/readings/${stripe!.id}`).expect(200)).body as ReadingDetail;
    assert.equal(detail.provenance.cluster?.index, 1);
    assert.equal(detail.provenance.cluster?.of, 2);
    assert.ok(Math.abs(detail.provenance.cluster!.share - 0.25) < 0.02, String(detail.provenance.cluster?.share));
    assert.ok(Math.abs(ground!.provenance.cluster!.share - 0.75) < 0.02);
    assert.deepEqual(detail.provenance.region, REGION);
    assert.equal(detail.provenance.uniform, false);
    // The readings export says the same: which colour of the region, of how many, and its share.
    const csvOf = async (characterId: number) => parseCsv((await recorder.get(`/api/readings/export.csv?characterId=${characterId}`).expect(200)).text, { bom: true, columns: true }) as Record<string, string>[];
    const rows = [...(await csvOf(ground!.characterId)), ...(await csvOf(stripe!.characterId))];
    const exported = (id: number) => rows.find((r) => Number(r['id']) === id) ?? assert.fail(`reading ${id} is exported`);
    assert.deepEqual([exported(ground!.id)['photo colour'], exported(stripe!.id)['photo colour']], ['1 of 2', '2 of 2']);
    assert.ok(Math.abs(Number(exported(stripe!.id)['photo colour share']) - 0.25) < 0.02, exported(stripe!.id)['photo colour share']);
    // And so do the BrAPI observations of the stripe reading (its L*, a*, b* and chip).
    const brapi = (await recorder.get(`/brapi/v2/observations?germplasmDbId=${stripe!.accessionId}&pageSize=1000`).expect(200)).body as { result: { data: { additionalInfo: Record<string, string> }[] } };
    const infos = brapi.result.data.map((o) => o.additionalInfo).filter((i) => i['readingId'] === String(stripe!.id));
    assert.equal(infos.length, 4);
    for (const info of infos) assert.deepEqual([info['photoColour'], Math.abs(Number(info['photoColourShare']) - 0.25) < 0.02], ['2 of 2', true]);
  });

  test('should keep a whole-region photo reading as the mean, with no colour index', async () => {
    const { cluster: _cluster, ...photo } = colourOf(striped, 'petiole.third.lower', 0).photo!;
    const res = await recorder.post('/api/readings/batch', { readings: [{ ...colourOf(striped, 'petiole.third.lower', 0), photo }] });
    assert.equal(res.status, 201, res.text);
    const [r] = (res.body as CreatedReadings).readings;
    const sample = (await recorder.post(`/api/photos/${striped.id}/sample`, { region: REGION }).expect(200)).body as PhotoSample;
    assert.ok(deltaE00(labFromTuple(r!.lab), labFromTuple(sample.lab)) < 1e-6);
    assert.equal(r!.provenance.cluster, null);
  });

  test('should save nothing when one reading of the batch is refused, naming its field', async () => {
    const before = await counts();
    const refusals: [CreateReadingRequest[], string][] = [
      // The region holds two colours: there is no third.
      [[colourOf(striped, 'petiole.third.middle', 0), colourOf(striped, 'petiole.stripes', 2)], 'readings.1.photo.cluster'],
      // An even region has no colours to choose from.
      [[colourOf(striped, 'petiole.third.middle', 0), colourOf(flat, 'petiole.stripes', 0)], 'readings.1.photo.cluster'],
      [[colourOf(striped, 'petiole.third.middle', 0), colourOf(striped, 'petiole.stripes', 1, { characterId: 999_999 })], 'readings.1.characterId'],
      [[colourOf(striped, 'petiole.third.middle', 0), colourOf(striped, 'petiole.stripes', 1, { observedAt: '2099-01-01T00:00:00Z' })], 'readings.1.observedAt'],
      [[colourOf(striped, 'petiole.stripes', 0), colourOf(striped, 'petiole.stripes', 1)], 'readings.1.characterId'],
      [[colourOf(striped, 'petiole.third.middle', 0), colourOf(striped, 'petiole.stripes', -1)], 'readings.1.photo.cluster'],
      [[colourOf(striped, 'petiole.third.middle', 0), { ...colourOf(striped, 'petiole.stripes', 1), light: 'moonlight' as never }], 'readings.1.light'],
      [[], 'readings'],
    ];
    for (const [readings, field] of refusals) {
      const res = await recorder.post('/api/readings/batch', { readings }).set(IDEMPOTENCY_HEADER, randomUUID());
      assertInvalidFields(res, field);
      assert.match(res.body.detail as string, /reading|readings/i);
    }
    assert.deepEqual(await counts(), before, 'no reading, audit event or idempotency key was written');
  });

  test('should answer a resend under the same Idempotency-Key from the first answer, storing nothing twice', async () => {
    const key = randomUUID();
    const body = { readings: [colourOf(striped, 'leaf.vein.junction', 0), colourOf(striped, 'leaf.vein.upper', 1)] };
    const first = await recorder.post('/api/readings/batch', body).set(IDEMPOTENCY_HEADER, key).expect(201);
    const before = await counts();
    const again = await recorder.post('/api/readings/batch', body).set(IDEMPOTENCY_HEADER, key).expect(201);
    assert.equal(again.headers[REPLAYED_HEADER.toLowerCase()], 'true');
    assert.deepEqual(again.body.readings.map((r: ReadingDetail) => r.id), first.body.readings.map((r: ReadingDetail) => r.id));
    assert.deepEqual(await counts(), before);
  });
});

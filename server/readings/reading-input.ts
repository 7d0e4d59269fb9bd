// Turning a reading as sent into the row that is stored: the ids checked, the colour taken by
// its method, matched against the current reference set, the season and plant age derived.
// No req/res, and nothing written here: create, supersede, import and the demo all insert the
// values this gives, each in its own transaction.
import { labD50ToD65 } from '../../shared/colour/chromatic-adaptation.js';
import type { EntityManager } from 'typeorm';
import { OBSERVED_AT_FUTURE_SLACK_MS } from '../../shared/api/reading-answers.js';
import type { CreateReadingBody } from '../../shared/api/readings.js';
import { plantAgeMonths } from '../../shared/collection/plant-age.js';
import { isoOfDate, localDateOf, seasonOfDate } from '../../shared/collection/season-of.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { labFromTuple, type Lab } from '../../shared/colour/lab.js';
import { parseHex } from '../../shared/colour/parse.js';
import { chipOf } from '../calibration/calibration-chips.js';
import { Accession, Plant } from '../collection/accession.entity.js';
import { Character } from '../collection/character.entity.js';
import { Site } from '../collection/site.entity.js';
import { serverDay } from '../core/day-words.js';
import { AppError, type FieldError } from '../core/app-error.js';
import type { PhotoFiles } from '../photos/photo-files.js';
import { Photo } from '../photos/photo.entity.js';
import type { PhotoSample } from '../../shared/api/photo-answers.js';
import { samplePhoto } from '../photos/photos.js';
import type { LoadedSet, ReferenceSets } from '../reference-sets/reference-sets.js';
import type { Reading } from './reading.entity.js';

/** What taking a reading's colour needs: the reference sets, and the photo store (null when the server has no data folder). */
export interface ColourSources {
  referenceSets: ReferenceSets;
  photos: PhotoFiles | null;
}

/** The columns of a new reading, before it has an id. */
export type ReadingValues = Omit<Reading, 'id' | 'createdAt' | 'accession' | 'plant' | 'character' | 'site' | 'observer' | 'photo' | 'supersedes' | 'supersededBy'>;

/** The reading fields of a create or supersede body (a supersede body adds `reason`). */
export type ReadingFields = CreateReadingBody;

/** What the colour of each method gives before matching. */
interface TakenColour {
  lab: Lab;
  source: string | null;
  provenance: Pick<ReadingValues, 'photoId' | 'region' | 'neutralRegion' | 'pixelCount' | 'pixelsDropped' | 'spreadDeltaE00' | 'uniform' | 'correction' | 'pipeline' | 'cluster'>;
  /** A photo's sample has matched already (against the same set). */
  best?: { code: string; name: string; hex: string; deltaE00: number; inputHex: string; inGamut: boolean };
}

const NO_PHOTO: TakenColour['provenance'] = { photoId: null, region: null, neutralRegion: null, pixelCount: null, pixelsDropped: null, spreadDeltaE00: null, uniform: null, correction: null, pipeline: null, cluster: null };

function refuse(errors: FieldError[]): AppError {
  return AppError.badRequest(`The reading is not valid: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}.`, errors);
}

/** The rows a reading names, each checked; one 400 lists every field that names nothing usable. */
async function lookups(m: EntityManager, body: ReadingFields) {
  const errors: FieldError[] = [];
  const accession = await m.findOne(Accession, { where: { id: body.accessionId }, relations: { site: true } });
  if (!accession) errors.push({ field: 'accessionId', message: `accession ${body.accessionId} does not exist` });
  const character = await m.findOneBy(Character, { id: body.characterId });
  if (!character) errors.push({ field: 'characterId', message: `character ${body.characterId} does not exist` });
  else if (!character.active) errors.push({ field: 'characterId', message: `${character.code} is no longer offered` });
  else if (!character.colour) errors.push({ field: 'characterId', message: `${character.code} is not a colour character (record it as an observation)` });
  let plant: Plant | null = null;
  if (body.plantId !== undefined && body.plantId !== null) {
    plant = await m.findOne(Plant, { where: { id: body.plantId }, relations: { accession: true, site: true } });
    if (!plant) errors.push({ field: 'plantId', message: `plant ${body.plantId} does not exist` });
    else if (accession && plant.accession.id !== accession.id) errors.push({ field: 'plantId', message: `plant ${plant.label} belongs to another accession` });
  }
  const siteId = body.siteId ?? plant?.site.id ?? accession?.site.id;
  const site = siteId === undefined ? null : await m.findOne(Site, { where: { id: siteId }, relations: { seasons: true } });
  if (!site && body.siteId !== undefined && body.siteId !== null) errors.push({ field: 'siteId', message: `site ${body.siteId} does not exist` });
  if (body.photo && !(await m.existsBy(Photo, { id: body.photo.photoId }))) errors.push({ field: 'photo.photoId', message: `photo ${body.photo.photoId} does not exist` });
  if (errors.length) throw refuse(errors);
  return { accession: accession!, character: character!, plant, site: site! };
}

function observedAtOf(value: string | undefined, now: Date): Date {
  if (value === undefined) return now;
  const at = new Date(value);
  if (at.getTime() > now.getTime() + OBSERVED_AT_FUTURE_SLACK_MS) throw refuse([{ field: 'observedAt', message: 'is in the future' }]);
  return at;
}

/** Sampling errors name the region within `photo`; a photo without files is a bad photo id. */
function asPhotoFieldError(err: unknown): unknown {
  if (!(err instanceof AppError)) return err;
  if (err.status === 404) return refuse([{ field: 'photo.photoId', message: err.detail ?? 'has no files' }]);
  if (err.status === 400) return new AppError(400, err.title, err.detail, (err.errors ?? [{ field: 'region', message: err.detail ?? 'refused' }]).map((e) => ({ ...e, field: `photo.${e.field}` })), err.slug);
  return err;
}

async function takeColour(m: EntityManager, src: ColourSources, set: LoadedSet, body: ReadingFields): Promise<TakenColour> {
  switch (body.method) {
    case 'instrument':
      // Stored readings are CIELAB D65/2°: a D50/2° instrument's numbers are adapted (Bradford); the rest are kept as reported.
      return { lab: body.illuminant === 'D50/2' ? labD50ToD65(labFromTuple(body.lab!)) : labFromTuple(body.lab!), source: null, provenance: NO_PHOTO };
    case 'chip': {
      const chip = chipOf(set, body.chipCode!, 'chipCode');
      return { lab: labFromTuple(chip.lab), source: chip.code, provenance: NO_PHOTO };
    }
    case 'swatch': {
      // The schema has checked the hex; normalised to "#rrggbb" lowercase for the record.
      const lab = parseHex(body.hex!)!;
      const raw = body.hex!.trim().replace(/^#/, '').toLowerCase();
      return { lab, source: `#${raw.length === 3 ? [...raw].map((c) => c + c).join('') : raw}`, provenance: NO_PHOTO };
    }
    case 'photo': {
      if (!src.photos) throw new AppError(503, 'Photos unavailable', 'This server was started without a data folder for photos.', undefined, 'no-photo-storage');
      const photo = body.photo!;
      const sample = await samplePhoto(m.connection, src.photos, (lab, k) => src.referenceSets.match(lab, k, set.summary.id), photo.photoId, { region: photo.region, neutral: photo.neutral, k: 1 }).catch((err: unknown) => {
        throw asPhotoFieldError(err);
      });
      if (photo.cluster !== undefined) return clusterColour(photo, sample);
      const best = sample.matches[0]!;
      return {
        lab: labFromTuple(sample.lab),
        source: null,
        provenance: photoProvenance(photo, sample, null),
        best: { code: best.code, name: best.name, hex: best.hex, deltaE00: best.deltaE00, inputHex: sample.hex, inGamut: sample.inGamut },
      };
    }
  }
}

/** Where a photo reading's colour came from: the region, its neutral, the sampling's counts and steps, and the colour chosen if the region was split. */
function photoProvenance(photo: NonNullable<ReadingFields['photo']>, sample: PhotoSample, cluster: TakenColour['provenance']['cluster']): TakenColour['provenance'] {
  return {
    photoId: photo.photoId,
    region: photo.region,
    neutralRegion: photo.neutral?.region ?? null,
    pixelCount: sample.pixelCount,
    pixelsDropped: sample.pixelsDropped,
    spreadDeltaE00: sample.spreadDeltaE00,
    uniform: sample.uniform,
    correction: sample.correction,
    pipeline: sample.pipeline,
    cluster,
  };
}

/**
 * One colour of a region that is not even, as the photo page listed it: the sampling is seeded and
 * deterministic, so the index the recorder chose names the same colour here. 400 on `photo.cluster`
 * when the region is even or holds fewer colours.
 */
function clusterColour(photo: NonNullable<ReadingFields['photo']>, sample: PhotoSample): TakenColour {
  const index = photo.cluster!;
  const cluster = sample.clusters[index];
  if (!cluster) {
    const held = sample.clusters.length === 0 ? 'the region is one colour (or too even to split)' : `the region holds ${sample.clusters.length} colours, numbered from 0`;
    throw refuse([{ field: 'photo.cluster', message: `names colour ${index}, but ${held}` }]);
  }
  return {
    lab: labFromTuple(cluster.lab),
    source: null,
    provenance: photoProvenance(photo, sample, { index, of: sample.clusters.length, share: cluster.share, spreadDeltaE00: cluster.spreadDeltaE00 }),
    best: { code: cluster.chip.code, name: cluster.chip.name, hex: cluster.chip.hex, deltaE00: cluster.chip.deltaE00, inputHex: cluster.hex, inGamut: cluster.inGamut },
  };
}

/**
 * The values of a new reading from a body as the schema passed it: 400 naming the field for
 * unknown or unusable ids (accession, character, plant, site, photo), a plant of another
 * accession, a chip not in the current set, a time in the future. Reads only.
 */
export async function prepareReading(m: EntityManager, src: ColourSources, body: ReadingFields, observerId: number, now = new Date()): Promise<ReadingValues> {
  const { accession, character, plant, site } = await lookups(m, body);
  const observedAt = observedAtOf(body.observedAt, now);
  const set = await src.referenceSets.current();
  const taken = await takeColour(m, src, set, body);
  const best = taken.best ?? (await bestOf(src, set, taken.lab));
  const eye = body.eyeChipCode ? chipOf(set, body.eyeChipCode, 'eyeChipCode') : null;
  const local = localDateOf(observedAt, site.timezone);
  // Days in words with the month named ("20 May 2025"): a refusal has no locale to follow, and an ISO date is not for people.
  if (plant && plant.plantedOn > isoOfDate(local)) throw refuse([{ field: 'plantId', message: `plant ${plant.label} was planted on ${serverDay(plant.plantedOn)}, after this reading (${serverDay(isoOfDate(local))} at ${site.code})` }]);
  const { season, seasonYear } = seasonOfDate(local, site.seasons);
  return {
    accessionId: accession.id,
    plantId: plant?.id ?? null,
    characterId: character.id,
    siteId: site.id,
    observerId,
    observedAt,
    method: body.method,
    l: taken.lab.l,
    a: taken.lab.a,
    b: taken.lab.b,
    hex: best.inputHex,
    inGamut: best.inGamut,
    setId: set.summary.id,
    bestChipCode: best.code,
    bestChipName: best.name,
    bestChipHex: best.hex,
    deltaE00: best.deltaE00,
    eyeChipCode: eye?.code ?? null,
    eyeDeltaE00: eye ? deltaE00(taken.lab, labFromTuple(eye.lab)) : null,
    ...taken.provenance,
    instrument: body.method === 'instrument' ? body.instrument || null : null,
    illuminant: body.method === 'instrument' ? (body.illuminant ?? null) : null,
    reportedLab: body.method === 'instrument' && body.illuminant === 'D50/2' ? body.lab! : null,
    source: taken.source,
    light: body.light ?? null,
    secondsSinceCut: body.secondsSinceCut ?? null,
    leafPosition: body.leafPosition || null,
    notes: body.notes || null,
    season,
    seasonYear,
    plantAgeMonths: plant ? plantAgeMonths(plant.plantedOn, local) : null,
    status: 'submitted',
    supersedesId: null,
    supersededById: null,
    supersedeReason: null,
  };
}

async function bestOf(src: ColourSources, set: LoadedSet, lab: Lab): Promise<NonNullable<TakenColour['best']>> {
  const answer = await src.referenceSets.match(lab, 1, set.summary.id);
  const best = answer.matches[0];
  if (!best) throw new AppError(503, 'No chips', `Reference set ${set.summary.id} has no chips.`, undefined, 'no-chips');
  return { code: best.code, name: best.name, hex: best.hex, deltaE00: best.deltaE00, inputHex: answer.input.hex, inGamut: answer.input.inGamut };
}

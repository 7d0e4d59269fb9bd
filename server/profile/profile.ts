// The characterisation record of one accession (issue 14): for each colour character with readings
// its accepted colour and how firmly it stands, and a summary of each non-colour descriptor. A plain
// domain function over the data source and the reference sets, so other routes (BrAPI, the PDF)
// call it too.
import type { DataSource } from 'typeorm';
import {
  CENTRE_STATISTIC,
  type AccessionProfile,
  type CharacterProfile,
  type ProfileColour,
  type ProfileFlag,
  type ProfileOutlier,
  type ProfilePhoto,
  type ProfileChip,
  type ProfileSetChip,
} from '../../shared/api/profile-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { groupSites, namerOf, seasonNamer, type SeasonNamer } from '../collection/season-names.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { labToLch, labToTuple, type Lab } from '../../shared/colour/lab.js';
import { verdictFor } from '../../shared/colour/verdict.js';
import { regionBounds } from '../../shared/photo/region.js';
import { analyseDrift, DRIFT_RULES_DEFAULT } from '../analysis/drift.js';
import { siteDifferencesWithinSeasons } from '../analysis/site-seasons.js';
import { findAccession } from '../collection/accessions.js';
import { Character } from '../collection/character.entity.js';
import type { ReferenceSets } from '../reference-sets/reference-sets.js';
import { describeDescriptors } from './descriptor-summary.js';
import { basisOf, groupBy, profileReadings, type ProfileReading } from './profile-readings.js';
import { labMedian } from './robust-centre.js';

/** What a profile is computed with. */
export interface ProfileDeps {
  ds: DataSource;
  referenceSets: ReferenceSets;
}

/** A CIELAB colour in every form the record shows. */
export function profileColour(lab: Lab): ProfileColour {
  const lch = labToLch(lab);
  const shown = displayHex(lab);
  return { lab: labToTuple(lab), lch: [lch.l, lch.c, lch.h], hex: shown.hex, inGamut: shown.inGamut };
}

/**
 * `GET /api/accessions/:id/profile`: the accession's characterisation record, matched against the
 * reference set given (the current one by default). 404 for an unknown accession or set.
 */
export async function accessionProfile(deps: ProfileDeps, accessionId: number, setId?: string): Promise<AccessionProfile> {
  const accession = await findAccession(deps.ds.manager, accessionId);
  const set = setId === undefined ? await deps.referenceSets.current() : await deps.referenceSets.get(setId);
  const characters = new Map((await deps.ds.getRepository(Character).find()).map((c) => [c.id, c]));
  const readings = await profileReadings(deps.ds, accessionId);
  const byCharacter = groupBy(readings, (r) => r.characterId);
  const siteCodes = new Map(readings.map((r) => [r.siteId, r.siteCode]));
  const named = await seasonNamer(deps.ds.manager);
  const sets = (await deps.referenceSets.list()).sort((a, b) => a.version - b.version);

  const profiles: CharacterProfile[] = [];
  for (const [characterId, rows] of byCharacter) {
    const character = characters.get(characterId)!;
    if (!character.colour) continue;
    const centre = labMedian(basisOf(rows).readings.map((r) => r.lab));
    const match = await deps.referenceSets.match(centre, 1, set.summary.id);
    const setChips: ProfileSetChip[] = [];
    for (const s of sets) {
      const best = s.id === set.summary.id ? match.matches[0]! : (await deps.referenceSets.match(centre, 1, s.id)).matches[0]!;
      setChips.push({ setId: s.id, current: s.current, shown: s.id === set.summary.id, chip: profileChip(best) });
    }
    profiles.push({ ...characterProfile(character, rows, match.matches[0]!, siteCodes, named), setChips });
  }
  const order = [...characters.values()].sort((a, b) => a.sortOrder - b.sortOrder || a.id - b.id).map((c) => c.id);
  profiles.sort((a, b) => order.indexOf(a.characterId) - order.indexOf(b.characterId));

  return {
    accessionId,
    accessionNumber: accession.accessionNumber,
    name: accession.name,
    referenceSet: { id: set.summary.id, version: set.summary.version, white: set.summary.white, observer: set.summary.observer },
    statistic: CENTRE_STATISTIC,
    characters: profiles,
    descriptors: await describeDescriptors(deps.ds, accessionId),
    computedAt: new Date().toISOString(),
  };
}

/** A matched chip as the record shows it, with its verdict. */
function profileChip(chip: { code: string; name: string; hex: string; deltaE00: number }): ProfileChip {
  return { code: chip.code, name: chip.name, hex: chip.hex, deltaE00: chip.deltaE00, verdict: verdictFor(chip.deltaE00) };
}

interface CharacterLike {
  id: number;
  code: string;
  label: string;
  organ: string;
  caution: string | null;
  driftThreshold: number;
}

/** One character's record from its readings in force and the chip nearest its centre. */
export function characterProfile(
  character: CharacterLike,
  rows: readonly ProfileReading[],
  chip: { code: string; name: string; hex: string; deltaE00: number },
  siteCodes: ReadonlyMap<number, string>,
  named: SeasonNamer = namerOf(new Set()),
): Omit<CharacterProfile, 'setChips'> {
  const { basis, readings } = basisOf(rows);
  const centre = labMedian(readings.map((r) => r.lab));
  const threshold = character.driftThreshold;
  const spread = readings.reduce((s, r) => s + deltaE00(centre, r.lab), 0) / readings.length;

  // Season and site centres and their flags use every reading in force, as the Drift pages do, so
  // the record and the drift overview agree even while only a few readings are approved.
  const seasons = [...groupBy(rows.filter((r) => r.season !== null && r.seasonYear !== null), (r) => `${r.seasonYear}\u0000${r.season}`).values()]
    .map((g) => {
      const c = labMedian(g.map((r) => r.lab));
      // A group pools the accession's sites: its season is named by both years if it wraps at one of them.
      return { season: g[0]!.season!, seasonYear: g[0]!.seasonYear!, seasonLabel: named(g[0]!.season, g[0]!.seasonYear, g.map((r) => r.siteId))!, n: g.length, centre: profileColour(c), deltaE00: deltaE00(centre, c), first: g[0]!.observedAt.getTime() };
    })
    .sort((a, b) => a.first - b.first)
    .map(({ first: _first, ...s }) => s);
  const sites = [...groupBy(rows, (r) => r.siteId).entries()]
    .map(([siteId, g]) => {
      const c = labMedian(g.map((r) => r.lab));
      return { siteId, siteCode: siteCodes.get(siteId) ?? String(siteId), n: g.length, centre: profileColour(c), deltaE00: deltaE00(centre, c) };
    })
    .sort((a, b) => a.siteCode.localeCompare(b.siteCode));

  const flags = flagsOf(rows, threshold, siteCodes, named);
  const outliers: ProfileOutlier[] = rows
    .map((r) => ({ r, de: deltaE00(centre, r.lab) }))
    .filter((x) => x.de > threshold)
    .sort((a, b) => b.de - a.de)
    .map(({ r, de }) => ({
      readingId: r.id,
      observedAt: r.observedAt.toISOString(),
      siteCode: r.siteCode,
      plantLabel: r.plantLabel,
      observerName: r.observerName,
      status: r.status,
      hex: r.hex,
      lab: labToTuple(r.lab),
      deltaE00: de,
    }));

  return {
    characterId: character.id,
    code: character.code,
    label: character.label,
    organ: character.organ,
    caution: character.caution,
    threshold,
    basis,
    centre: profileColour(centre),
    chip: profileChip(chip),
    spreadDeltaE00: spread,
    nReadings: readings.length,
    nObservers: new Set(readings.map((r) => r.observerId)).size,
    nPlants: new Set(readings.map((r) => r.plantId).filter((p) => p !== null)).size,
    nCurrent: rows.length,
    seasons,
    sites,
    flags,
    flagged: flags.length > 0,
    outliers,
    photo: photoOf(readings, centre),
  };
}

/** Season drift and within-season site differences flagged by the analysis rules, largest ΔE00 first. */
function flagsOf(readings: readonly ProfileReading[], threshold: number, siteCodes: ReadonlyMap<number, string>, named: SeasonNamer): ProfileFlag[] {
  const rules = { ...DRIFT_RULES_DEFAULT, threshold };
  const sitesOf = groupSites(readings);
  const name = (k: { season: string; seasonYear: number }) => named(k.season, k.seasonYear, sitesOf.get(`${k.seasonYear}|${k.season}`) ?? []);
  const drift = analyseDrift(readings, rules)
    .comparisons.filter((c) => c.drift)
    .map((c): ProfileFlag => ({ kind: 'season-drift', label: `${name(c.from)} → ${name(c.to)}`, deltaE00: c.deltaE00, pValue: c.pValue, reason: c.reason }));
  const sites = siteDifferencesWithinSeasons(readings, rules)
    .filter((d) => d.flagged)
    .map((d): ProfileFlag => ({
      kind: 'site-difference',
      label: `${siteCodes.get(d.siteA) ?? d.siteA} ↔ ${siteCodes.get(d.siteB) ?? d.siteB} in ${named(d.season, d.seasonYear, [d.siteA, d.siteB])}`,
      deltaE00: d.deltaE00,
      pValue: d.pValue,
      reason: d.reason,
    }));
  return [...drift, ...sites].sort((a, b) => b.deltaE00 - a.deltaE00);
}

/** The photo reading whose colour lies nearest the centre: the crop that shows the accepted colour on the plant. */
function photoOf(readings: readonly ProfileReading[], centre: Lab): ProfilePhoto | null {
  let best: { r: ProfileReading; de: number } | null = null;
  for (const r of readings) {
    if (r.photoId === null || r.region === null || r.photoWidth === null || r.photoHeight === null) continue;
    const de = deltaE00(centre, r.lab);
    if (!best || de < best.de) best = { r, de };
  }
  if (!best) return null;
  const b = regionBounds(best.r.region!);
  const x = Math.max(0, Math.floor(b.minX));
  const y = Math.max(0, Math.floor(b.minY));
  const box = { x, y, width: Math.min(best.r.photoWidth!, Math.ceil(b.maxX)) - x, height: Math.min(best.r.photoHeight!, Math.ceil(b.maxY)) - y };
  return { readingId: best.r.id, photoId: best.r.photoId!, width: best.r.photoWidth!, height: best.r.photoHeight!, box, deltaE00: best.de };
}

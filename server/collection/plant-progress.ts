import { In, IsNull, type DataSource } from 'typeorm';
import type { PlantProgress, ProgressCount, ProgressState } from '../../shared/api/plant-sheet-answers.js';
import { localDateOf, seasonLabel, seasonOf } from '../../shared/collection/season-of.js';
import { Reading } from '../readings/reading.entity.js';
import type { Plant } from './accession.entity.js';
import { Character } from './character.entity.js';
import { Descriptor } from './descriptor.entity.js';
import { Observation } from './observation.entity.js';
import { PlantSkip } from './plant-skip.entity.js';
import type { Site } from './site.entity.js';

/** A season occurrence at a site: its name (null when no season covers the day) and season-year. */
export interface SeasonWindow {
  season: string | null;
  seasonYear: number;
}

/**
 * The season of an instant at a site. A day no season covers belongs to a nameless window of its
 * local calendar year, so a site without a scheme still has a "this season" (our own rule).
 */
export function seasonWindowOf(instant: Date, site: Site): SeasonWindow {
  const found = seasonOf(instant, site.timezone, site.seasons ?? []);
  if (found.season !== null && found.seasonYear !== null) return { season: found.season, seasonYear: found.seasonYear };
  return { season: null, seasonYear: localDateOf(instant, site.timezone).year };
}

/** A window as people say it ("Wet 2024–25" for a season of the site that wraps the year end); null with no season. */
export function windowLabel(window: SeasonWindow, site: Site): string | null {
  const season = site.seasons?.find((s) => s.name === window.season);
  return seasonLabel(window.season, window.seasonYear, season !== undefined && season.end < season.start);
}

function sameWindow(a: SeasonWindow, b: SeasonWindow): boolean {
  return a.season === b.season && a.seasonYear === b.seasonYear;
}

/** What the sheet lists: active colour characters and active typed descriptors (ratios are computed), in walk order. */
export interface SheetCatalogue {
  characters: Character[];
  descriptors: Descriptor[];
}

/** Loads the catalogue the sheet and the progress counts walk. */
export async function sheetCatalogue(ds: DataSource): Promise<SheetCatalogue> {
  const characters = await ds.getRepository(Character).find({ where: { active: true, colour: true }, order: { sortOrder: 'ASC', id: 'ASC' } });
  const descriptors = (await ds.getRepository(Descriptor).find({ where: { active: true }, order: { sortOrder: 'ASC', id: 'ASC' } })).filter((d) => d.kind !== 'ratio');
  return { characters, descriptors };
}

/** The latest reading, observation and skip of each character and descriptor of one plant, this season. */
export interface PlantState {
  plant: Plant;
  window: SeasonWindow;
  readings: Map<number, Reading>;
  observations: Map<number, Observation>;
  characterSkips: Map<number, PlantSkip>;
  descriptorSkips: Map<number, PlantSkip>;
}

/**
 * Reads, for each plant (relations `accession` and `site.seasons` loaded), what is done and
 * skipped in the season holding `at` at the plant's site. Current rows only (a superseded reading
 * or observation is replaced by its correction); the newest in the season wins.
 */
export async function plantStates(ds: DataSource, plants: readonly Plant[], at: Date): Promise<PlantState[]> {
  const ids = plants.map((p) => p.id);
  const states = new Map<number, PlantState>(
    plants.map((plant) => [plant.id, { plant, window: seasonWindowOf(at, plant.site), readings: new Map(), observations: new Map(), characterSkips: new Map(), descriptorSkips: new Map() }]),
  );
  if (!ids.length) return [];
  const readings = await ds.getRepository(Reading).find({ where: { plantId: In(ids), supersededById: IsNull() }, order: { observedAt: 'DESC', id: 'DESC' } });
  for (const r of readings) {
    const state = states.get(r.plantId!)!;
    if (!state.readings.has(r.characterId) && sameWindow(seasonWindowOf(r.observedAt, state.plant.site), state.window)) state.readings.set(r.characterId, r);
  }
  const observations = await ds.getRepository(Observation).find({ where: { plant: { id: In(ids) }, supersededBy: IsNull() }, relations: { plant: true, descriptor: true }, order: { observedAt: 'DESC', id: 'DESC' } });
  for (const o of observations) {
    const state = states.get(o.plant!.id)!;
    if (!state.observations.has(o.descriptor.id) && sameWindow(seasonWindowOf(o.observedAt, state.plant.site), state.window)) state.observations.set(o.descriptor.id, o);
  }
  const skips = await ds.getRepository(PlantSkip).find({ where: { plantId: In(ids) }, order: { createdAt: 'DESC', id: 'DESC' } });
  for (const s of skips) {
    const state = states.get(s.plantId)!;
    if (!sameWindow({ season: s.season, seasonYear: s.seasonYear }, state.window)) continue;
    const into = s.characterId !== null ? state.characterSkips : state.descriptorSkips;
    const key = (s.characterId ?? s.descriptorId)!;
    if (!into.has(key)) into.set(key, s);
  }
  return ids.map((id) => states.get(id)!);
}

function count<T extends { id: number }>(items: readonly T[], done: Map<number, unknown>, skipped: Map<number, unknown>): ProgressCount {
  const doneCount = items.filter((i) => done.has(i.id)).length;
  return { done: doneCount, skipped: items.filter((i) => !done.has(i.id) && skipped.has(i.id)).length, total: items.length };
}

/** Complete when every row is done or skipped (and there is at least one), not started when nothing is done. */
export function progressState(colour: ProgressCount, descriptors: ProgressCount): ProgressState {
  const settled = colour.done + colour.skipped + descriptors.done + descriptors.skipped;
  const total = colour.total + descriptors.total;
  if (total > 0 && settled >= total) return 'complete';
  return colour.done + descriptors.done > 0 ? 'partial' : 'not-started';
}

/** One plant's counts from its state. */
export function progressOf(state: PlantState, catalogue: SheetCatalogue): PlantProgress {
  const { plant } = state;
  const colour = count(catalogue.characters, state.readings, state.characterSkips);
  const descriptors = count(catalogue.descriptors, state.observations, state.descriptorSkips);
  return {
    plantId: plant.id,
    plantLabel: plant.label,
    accessionId: plant.accession.id,
    accessionNumber: plant.accession.accessionNumber,
    accessionName: plant.accession.name,
    siteId: plant.site.id,
    siteCode: plant.site.code,
    season: state.window.season,
    seasonYear: state.window.seasonYear,
    seasonLabel: windowLabel(state.window, plant.site),
    colour,
    descriptors,
    state: progressState(colour, descriptors),
  };
}

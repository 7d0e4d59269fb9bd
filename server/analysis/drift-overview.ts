// The drift overview (issue 14): every accession × character of the collection whose colour the
// drift rules flag, between seasons or between sites within one season, largest ΔE00 first. The
// permutation tests are the expensive part, so each pair's flags are kept under a signature of its
// readings and recomputed only when those change, and a large batch of changed pairs goes to
// worker threads.
import type { DataSource } from 'typeorm';
import type { DriftOverviewAnswer, DriftOverviewItem } from '../../shared/api/analysis-answers.js';
import { OBSERVED_AT_MS_SQL, rawRows } from './drift-query.js';
import type { DriftPool } from './drift-pool.js';
import { pairFlags, type PairFlags, type PairInput } from './pair-flags.js';
import { seasonNamer } from '../collection/season-names.js';

/** accessionId, characterId, siteId, L*, a*, b*, season, season-year, observed at (epoch ms). */
type RawRow = [number, number, number, number, number, number, string | null, number | null, number];

interface PairSummary {
  accessionId: number;
  characterId: number;
  n: number;
  maxId: number;
  sumId: number;
}

/** Below this many readings to analyse, worker threads cost more to wake than they save (our own measure). */
const WORKER_MIN_READINGS = 20_000;
/** Batches the readings are read in when workers analyse them (our own choice: on 2 cores 1 and 4 batches measured alike, 7–9× the floor; more cores overlap more). */
const FETCH_BATCHES = 4;

/** The overview of one app: its cache of pair flags and, optionally, a worker pool. */
export class DriftOverview {
  private readonly cache = new Map<string, { signature: string; flags: PairFlags }>();
  private last: { version: string; answer: DriftOverviewAnswer } | null = null;

  constructor(
    private readonly ds: DataSource,
    private readonly pool: DriftPool | null = null,
  ) {}

  /** Forgets every kept result, so the next answer recomputes every pair (the benchmark's cold run). */
  clear(): void {
    this.cache.clear();
    this.last = null;
  }

  /** The overview now; pairs whose readings (or threshold) did not change since the last answer are not analysed again. */
  async answer(): Promise<DriftOverviewAnswer> {
    const version = await this.dataVersion();
    if (this.last?.version === version) return { ...this.last.answer, recomputed: 0 };

    const thresholds = new Map<number, { code: string; label: string; threshold: number; colour: boolean }>(
      (await this.ds.query('SELECT "id", "code", "label", "driftThreshold", "colour" FROM "character"')).map((c: { id: number; code: string; label: string; driftThreshold: number; colour: number }) => [
        c.id,
        { code: c.code, label: c.label, threshold: c.driftThreshold, colour: Boolean(c.colour) },
      ]),
    );
    const summaries: PairSummary[] = await this.ds.query(
      `SELECT "accessionId", "characterId", COUNT(*) AS "n", MAX("id") AS "maxId", SUM("id") AS "sumId"
         FROM "reading" WHERE "supersededById" IS NULL GROUP BY "accessionId", "characterId"`,
    );
    // A reading's colour, site and season never change (a correction is a new row), so the count,
    // largest and summed ids of the readings in force, with the threshold, identify what a pair's analysis saw.
    const signatureOf = (s: PairSummary) => `${s.n}|${s.maxId}|${s.sumId}|${thresholds.get(s.characterId)?.threshold}`;
    const live = summaries.filter((s) => thresholds.get(s.characterId)?.colour);
    const stale = live.filter((s) => this.cache.get(keyOf(s))?.signature !== signatureOf(s));

    const total = stale.reduce((sum, s) => sum + Number(s.n), 0);
    const results = this.pool && total >= WORKER_MIN_READINGS ? await this.inWorkers(this.pool, stale, thresholds) : (await this.inputsOf(stale, thresholds)).map(pairFlags);
    for (const [i, s] of stale.entries()) this.cache.set(keyOf(s), { signature: signatureOf(s), flags: results[i]! });
    const liveKeys = new Set(live.map(keyOf));
    for (const key of this.cache.keys()) if (!liveKeys.has(key)) this.cache.delete(key);

    const answer: DriftOverviewAnswer = {
      items: await this.items(live, thresholds),
      pairs: live.length,
      readings: live.reduce((sum, s) => sum + Number(s.n), 0),
      recomputed: stale.length,
      computedAt: new Date().toISOString(),
    };
    this.last = { version, answer };
    return answer;
  }

  /** What changes whenever a reading is added, superseded or a threshold is set: cheap to ask before anything else. */
  private async dataVersion(): Promise<string> {
    const [r] = await this.ds.query('SELECT COUNT(*) AS "n", MAX("id") AS "maxId", COUNT("supersededById") AS "superseded" FROM "reading"');
    const [c] = await this.ds.query('SELECT GROUP_CONCAT("id" || \':\' || "driftThreshold" || \':\' || "colour") AS "t" FROM "character"');
    return `${r.n}|${r.maxId}|${r.superseded}|${c.t}`;
  }

  /**
   * The stale pairs analysed in the worker threads. Their readings are read in a few batches of
   * accessions, each handed to the workers as soon as it is read, so the workers analyse one batch
   * while this thread reads the next (reading 100,000 rows costs about as much as analysing them).
   */
  private async inWorkers(pool: DriftPool, stale: readonly PairSummary[], thresholds: ReadonlyMap<number, { threshold: number }>): Promise<PairFlags[]> {
    const accessions = [...new Set(stale.map((s) => s.accessionId))].sort((x, y) => x - y);
    const per = Math.ceil(accessions.length / FETCH_BATCHES);
    const runs: Promise<PairFlags[]>[] = [];
    for (let i = 0; i < accessions.length; i += per) {
      const range: [number, number] = [accessions[i]!, accessions[Math.min(i + per, accessions.length) - 1]!];
      const batch = stale.filter((s) => s.accessionId >= range[0] && s.accessionId <= range[1]);
      runs.push(pool.run(await this.inputsOf(batch, thresholds, range)));
    }
    const byKey = new Map((await Promise.all(runs)).flat().map((r) => [r.key, r]));
    return stale.map((s) => byKey.get(keyOf(s))!);
  }

  /** The readings of the stale pairs (of accessions in `range`, when given), as plain columns. */
  private async inputsOf(stale: readonly PairSummary[], thresholds: ReadonlyMap<number, { threshold: number }>, range?: readonly [number, number]): Promise<PairInput[]> {
    if (!stale.length) return [];
    const wanted = new Set(stale.map(keyOf));
    const byKey = new Map<string, PairInput>(
      stale.map((s) => [keyOf(s), { key: keyOf(s), threshold: thresholds.get(s.characterId)!.threshold, siteId: [], l: [], a: [], b: [], season: [], seasonYear: [], observedAt: [] }]),
    );
    // One pass over the readings in force when many pairs are stale; per pair (index) when few.
    // Rows come back as arrays from better-sqlite3 itself (TypeORM's layer would build an object
    // per row, which dominates a 100,000-row read), with the instant as epoch milliseconds from
    // SQLite's julianday (TypeORM stores "YYYY-MM-DD HH:MM:SS.SSS" UTC text).
    const columns = `"accessionId", "characterId", "siteId", "l", "a", "b", "season", "seasonYear", ${OBSERVED_AT_MS_SQL}`;
    const rows: RawRow[] = range
      ? rawRows<RawRow>(this.ds, `SELECT ${columns} FROM "reading" WHERE "accessionId" BETWEEN ? AND ? AND "supersededById" IS NULL ORDER BY "observedAt", "id"`, range)
      : stale.length > 50
        ? rawRows<RawRow>(this.ds, `SELECT ${columns} FROM "reading" WHERE "supersededById" IS NULL ORDER BY "observedAt", "id"`)
        : stale.flatMap((s) =>
            rawRows<RawRow>(this.ds, `SELECT ${columns} FROM "reading" WHERE "accessionId" = ? AND "characterId" = ? AND +"supersededById" IS NULL ORDER BY "observedAt", "id"`, [s.accessionId, s.characterId]),
          );
    for (const [accessionId, characterId, siteId, l, a, b, season, seasonYear, at] of rows) {
      const key = `${accessionId}:${characterId}`;
      if (!wanted.has(key)) continue;
      const p = byKey.get(key)!;
      p.siteId.push(siteId);
      p.l.push(l);
      p.a.push(a);
      p.b.push(b);
      p.season.push(season);
      p.seasonYear.push(seasonYear);
      p.observedAt.push(at);
    }
    return stale.map((s) => byKey.get(keyOf(s))!);
  }

  /** Flagged pairs with their names, largest ΔE00 first. */
  private async items(live: readonly PairSummary[], characters: ReadonlyMap<number, { code: string; label: string }>): Promise<DriftOverviewItem[]> {
    const flagged = live.filter((s) => this.cache.get(keyOf(s))!.flags.flags.length > 0);
    if (!flagged.length) return [];
    const accessions = new Map<number, { accessionNumber: string; name: string }>(
      (await this.ds.query('SELECT "id", "accessionNumber", "name" FROM "accession"')).map((a: { id: number; accessionNumber: string; name: string }) => [a.id, a]),
    );
    const sites = new Map<number, string>((await this.ds.query('SELECT "id", "code" FROM "site"')).map((s: { id: number; code: string }) => [s.id, s.code]));
    // A group pools readings over sites: its season is named by both years if it wraps at one of them.
    const named = await seasonNamer(this.ds.manager);
    return flagged
      .map((s): DriftOverviewItem => {
        const { flags, n } = this.cache.get(keyOf(s))!.flags;
        const character = characters.get(s.characterId)!;
        const accession = accessions.get(s.accessionId)!;
        return {
          accessionId: s.accessionId,
          accessionNumber: accession.accessionNumber,
          accessionName: accession.name,
          characterId: s.characterId,
          characterCode: character.code,
          characterLabel: character.label,
          n,
          deltaE00: flags[0]!.deltaE00,
          flags: flags.map((f) => ({
            kind: f.kind,
            label: f.kind === 'season-drift' ? `${named(f.from!.season, f.from!.seasonYear, f.fromSiteIds ?? [])} → ${named(f.to!.season, f.to!.seasonYear, f.toSiteIds ?? [])}` : `${sites.get(f.siteA!) ?? f.siteA} ↔ ${sites.get(f.siteB!) ?? f.siteB} in ${named(f.season ?? null, f.seasonYear ?? null, [f.siteA!, f.siteB!])}`,
            deltaE00: f.deltaE00,
            pValue: f.pValue,
            reason: f.reason,
            season: f.season ?? null,
            seasonYear: f.seasonYear ?? null,
          })),
        };
      })
      .sort((x, y) => y.deltaE00 - x.deltaE00 || x.accessionNumber.localeCompare(y.accessionNumber) || x.characterCode.localeCompare(y.characterCode));
  }
}

function keyOf(p: { accessionId: number; characterId: number }): string {
  return `${p.accessionId}:${p.characterId}`;
}

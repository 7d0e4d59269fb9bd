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

    const inputs = await this.inputsOf(stale, thresholds);
    const total = inputs.reduce((sum, p) => sum + p.l.length, 0);
    const results = this.pool && total >= WORKER_MIN_READINGS ? await this.pool.run(inputs) : inputs.map(pairFlags);
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

  /** The readings of the stale pairs, in one query per batch of pairs, as plain columns. */
  private async inputsOf(stale: readonly PairSummary[], thresholds: ReadonlyMap<number, { threshold: number }>): Promise<PairInput[]> {
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
    const rows: RawRow[] =
      stale.length > 50
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

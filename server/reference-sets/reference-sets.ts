import type { DataSource } from 'typeorm';
import type { ChipDto, MatchAnswer, ReferenceSetSummary } from '../../shared/api/reference-set-answers.js';
import type { Lab } from '../../shared/colour/lab.js';
import { createMatcher, type Matcher } from '../../shared/colour/matcher.js';
import { matchAnswer } from '../../shared/api/match-answer.js';
import { chipNames } from '../../shared/colour/chip-name.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Chip, ReferenceSet, ReferenceSetChoice } from './reference-set.entity.js';

/** A stored set with all its chips in code order and its index, ready to match. */
export interface LoadedSet {
  /** The set's summary; whether it is current is asked of `ReferenceSets.list()`, as a newer set may arrive. */
  summary: Omit<ReferenceSetSummary, 'current'>;
  chips: readonly ChipDto[];
  /** The chips by code. */
  byCode: ReadonlyMap<string, ChipDto>;
  matcher: Matcher<ChipDto>;
}

interface ChipRow {
  code: string;
  parent: string | null;
  l: number;
  a: number;
  b: number;
  hex: string;
  inGamut: number | boolean;
}

/**
 * The stored reference sets. A set's rows never change once loaded, so each set's chips and its
 * index are read and built once per process, on first use, and kept.
 */
export class ReferenceSets {
  private readonly loaded = new Map<string, Promise<LoadedSet>>();
  /**
   * Field and fine chip counts per set. A set's chips are written in the same transaction as the
   * set and never change, so a count once read stays true; counting 50,000 rows on every reading
   * detail cost about 40 ms.
   */
  private readonly chipCounts = new Map<string, { field: number; fine: number }>();

  constructor(private readonly ds: DataSource) {}

  /**
   * The id of the set new readings are matched against: the latest admin choice, or, while no
   * one has chosen, the first set loaded (lowest version); null when no set is stored.
   */
  async currentId(): Promise<string | null> {
    const [choice] = await this.ds.getRepository(ReferenceSetChoice).find({ order: { id: 'DESC' }, take: 1 });
    if (choice) return choice.setId;
    const [first] = await this.ds.getRepository(ReferenceSet).find({ order: { version: 'ASC' }, take: 1 });
    return first?.id ?? null;
  }

  /** Makes a stored set the current one (added as a new choice, audited); 404 when there is no such set. */
  async choose(setId: string, actor: Actor): Promise<void> {
    await this.ds.transaction(async (m) => {
      if (!(await m.findOneBy(ReferenceSet, { id: setId }))) throw AppError.notFound(`There is no reference set ${setId}.`);
      const before = await m.find(ReferenceSetChoice, { order: { id: 'DESC' }, take: 1 });
      await m.insert(ReferenceSetChoice, { setId, chosenAt: new Date(), chosenById: actor.id });
      await recordAudit(m, actor, 'reference-set.current', setId, { before: before[0]?.setId ?? null });
    });
  }

  /** Every stored set, newest version first, with the current one marked (`currentId`). */
  async list(): Promise<ReferenceSetSummary[]> {
    const sets = await this.ds.getRepository(ReferenceSet).find({ order: { version: 'DESC' } });
    const uncounted = sets.filter((s) => !this.chipCounts.has(s.id)).map((s) => s.id);
    if (uncounted.length) {
      const rows: { setId: string; kind: string; n: number }[] = await this.ds
        .getRepository(Chip)
        .createQueryBuilder('chip')
        .select(['chip.setId AS setId', 'chip.kind AS kind', 'COUNT(*) AS n'])
        .where('chip.setId IN (:...uncounted)', { uncounted })
        .groupBy('chip.setId')
        .addGroupBy('chip.kind')
        .getRawMany();
      for (const id of uncounted) {
        const n = (kind: string) => Number(rows.find((r) => r.setId === id && r.kind === kind)?.n ?? 0);
        this.chipCounts.set(id, { field: n('field'), fine: n('fine') });
      }
    }
    const count = (setId: string, kind: 'field' | 'fine') => this.chipCounts.get(setId)![kind];
    const currentId = await this.currentId();
    return sets.map((s) => ({
      id: s.id,
      name: s.name,
      version: s.version,
      white: s.white,
      observer: s.observer,
      fieldChips: count(s.id, 'field'),
      fineChips: count(s.id, 'fine'),
      current: s.id === currentId,
    }));
  }

  /** The set with this id, loaded; 404 when there is none. */
  async get(id: string): Promise<LoadedSet> {
    let set = this.loaded.get(id);
    if (!set) {
      set = this.load(id);
      this.loaded.set(id, set);
      // A failed load (no such set, a closed database) is not kept, so a later call tries again.
      set.catch(() => this.loaded.delete(id));
    }
    return set;
  }

  /** The set new readings are matched against (`currentId`). */
  async current(): Promise<LoadedSet> {
    const id = await this.currentId();
    if (id === null) throw new AppError(503, 'No reference set', 'No reference set is loaded; the server loads reference-colors/ at start-up.', undefined, 'no-reference-set');
    return this.get(id);
  }

  /** The `k` chips nearest a CIELAB colour and where it falls between the two nearest, in the set given or the current one. */
  async match(lab: Lab, k: number, setId?: string): Promise<MatchAnswer> {
    const set = setId === undefined ? await this.current() : await this.get(setId);
    return matchAnswer(set.matcher, set.summary.id, lab, k);
  }

  private async load(id: string): Promise<LoadedSet> {
    const listed = (await this.list()).find((s) => s.id === id);
    if (!listed) throw AppError.notFound(`There is no reference set ${id}.`);
    const { current: _current, ...summary } = listed;
    // Raw rows: hydrating 11,700 entities costs a few hundred milliseconds more and gives nothing here.
    const rows: ChipRow[] = await this.ds
      .getRepository(Chip)
      .createQueryBuilder('chip')
      .select(['chip.code AS code', 'chip.parent AS parent', 'chip.l AS l', 'chip.a AS a', 'chip.b AS b', 'chip.hex AS hex', 'chip.inGamut AS inGamut'])
      .where('chip.setId = :id', { id })
      .orderBy('chip.code', 'ASC')
      .getRawMany();
    // A name is derived data: every set's chips are named by today's scheme from their CIELAB and
    // their parent's, whatever words the file stored (v1's file keeps its own, never shown).
    const names = chipNames(rows.map((r) => ({ code: r.code, parent: r.parent, lab: [r.l, r.a, r.b] as const })));
    const chips: ChipDto[] = rows.map((r, i) => ({ code: r.code, parent: r.parent, name: names[i]!, lab: [r.l, r.a, r.b], hex: r.hex, inGamut: Boolean(r.inGamut) }));
    return { summary, chips, byCode: new Map(chips.map((c) => [c.code, c])), matcher: createMatcher(chips) };
  }
}

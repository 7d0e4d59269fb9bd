import { In, type DataSource } from 'typeorm';
import { chipName } from '../../shared/colour/chip-name.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { Chip } from './reference-set.entity.js';

/** A row that names a chip of a set and carries a copy of the chip's name taken when it was stored. */
export interface NamedChipRow {
  setId: string;
  bestChipCode: string;
  bestChipName: string;
}

/**
 * Gives each row the name its best chip has today (`chipName`, from the chip's CIELAB and its
 * parent's), in memory only: a chip's name is derived data, and a reading stored with a name in
 * an older wording must not show it. Nothing is written back; a chip no longer stored keeps the
 * copied name.
 */
export async function nameBestChips<T extends NamedChipRow>(ds: DataSource, rows: readonly T[]): Promise<readonly T[]> {
  const wanted = new Map<string, Set<string>>();
  for (const r of rows) {
    const codes = wanted.get(r.setId) ?? new Set<string>();
    codes.add(r.bestChipCode);
    // A fine chip's name depends on its parent's: fetch the parent too.
    const dot = r.bestChipCode.indexOf('.');
    if (dot > 0) codes.add(r.bestChipCode.slice(0, dot));
    wanted.set(r.setId, codes);
  }
  const names = new Map<string, string>();
  for (const [setId, codes] of wanted) {
    const chips = await ds.getRepository(Chip).find({ where: { setId, code: In([...codes]) }, select: { code: true, parent: true, l: true, a: true, b: true } });
    const labs = new Map(chips.map((c) => [c.code, labFromTuple([c.l, c.a, c.b])]));
    for (const c of chips) names.set(`${setId} ${c.code}`, chipName(labs.get(c.code)!, c.parent === null ? null : (labs.get(c.parent) ?? null)));
  }
  for (const r of rows) r.bestChipName = names.get(`${r.setId} ${r.bestChipCode}`) ?? r.bestChipName;
  return rows;
}

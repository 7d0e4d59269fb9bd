import type { DataSource } from 'typeorm';
import type { WalkEntry, WalkOrderBody } from '../../shared/api/plant-sheet.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Character } from './character.entity.js';
import { Descriptor } from './descriptor.entity.js';

/** Both catalogues as one walk, by place then kind (characters first) then id. */
export async function walkOrder(ds: DataSource): Promise<WalkEntry[]> {
  const characters = await ds.getRepository(Character).find({ where: { colour: true } });
  const descriptors = await ds.getRepository(Descriptor).find();
  const entries: WalkEntry[] = [
    ...characters.map((c) => ({ kind: 'character' as const, id: c.id, code: c.code, label: c.label, sortOrder: c.sortOrder, active: c.active, characterId: null })),
    ...descriptors.map((d) => ({ kind: 'descriptor' as const, id: d.id, code: d.code, label: d.label, sortOrder: d.sortOrder, active: d.active, characterId: d.characterId ?? null })),
  ];
  return entries.sort((a, b) => a.sortOrder - b.sortOrder || (a.kind === b.kind ? a.id - b.id : a.kind === 'character' ? -1 : 1));
}

/**
 * Renumbers the walk as given, in steps of ten. The list must name every colour character and
 * every descriptor exactly once, so no entry is left at a stale place; 400 naming `items` otherwise.
 */
export async function setWalkOrder(ds: DataSource, actor: Actor, body: WalkOrderBody): Promise<WalkEntry[]> {
  await ds.transaction(async (m) => {
    const characters = await m.find(Character, { where: { colour: true } });
    const descriptors = await m.find(Descriptor);
    const known = new Set([...characters.map((c) => `character:${c.id}`), ...descriptors.map((d) => `descriptor:${d.id}`)]);
    const given = body.items.map((i) => `${i.kind}:${i.id}`);
    const seen = new Set<string>();
    for (const key of given) {
      if (!known.has(key)) throw AppError.badRequest(`No ${key.replace(':', ' ')} in the catalogue.`, [{ field: 'items', message: `${key} is not a colour character or descriptor of the catalogue` }]);
      if (seen.has(key)) throw AppError.badRequest(`${key} is listed twice.`, [{ field: 'items', message: `lists ${key} twice` }]);
      seen.add(key);
    }
    const missing = [...known].filter((k) => !seen.has(k));
    if (missing.length) throw AppError.badRequest(`The order leaves out ${missing.length} entries.`, [{ field: 'items', message: `must list every entry; missing ${missing.slice(0, 5).join(', ')}${missing.length > 5 ? '…' : ''}` }]);
    for (const [i, item] of body.items.entries()) {
      await m.update(item.kind === 'character' ? Character : Descriptor, { id: item.id }, { sortOrder: (i + 1) * 10 });
    }
    await recordAudit(m, actor, 'catalogue.reordered', null, { order: given });
  });
  return walkOrder(ds);
}

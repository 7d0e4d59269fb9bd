import type { DataSource } from 'typeorm';
import { recordAudit, SYSTEM } from '../audit/audit.js';
import { CHARACTER_CATALOGUE } from './character-catalogue.js';
import { Character } from './character.entity.js';
import { DESCRIPTOR_CATALOGUE } from './descriptor-catalogue.js';
import { Descriptor } from './descriptor.entity.js';
import { walkOrderOf } from './walk-order.js';

/**
 * Adds every catalogue character whose code is not in the database yet. Rows already stored are
 * never touched, so an admin's edits to a seeded character (label, how to read it, caution,
 * active, drift threshold) survive every restart. Runs at every start; returns how many were added.
 */
export async function seedCharacterCatalogue(ds: DataSource): Promise<number> {
  return ds.transaction(async (m) => {
    const existing = new Set((await m.find(Character, { select: { code: true } })).map((c) => c.code));
    const missing = CHARACTER_CATALOGUE.map((c, i) => ({ ...c, sortOrder: walkOrderOf(c.code, (i + 1) * 10), active: true })).filter((c) => !existing.has(c.code));
    if (missing.length) {
      await m.insert(Character, missing);
      await recordAudit(m, SYSTEM, 'catalogue.seeded', null, { added: missing.map((c) => c.code) });
    }
    return missing.length;
  });
}

/**
 * Adds every catalogue descriptor whose code is not in the database yet, leaving stored rows
 * (and so admins' edits) alone, like `seedCharacterCatalogue`. Runs at every start.
 */
export async function seedDescriptorCatalogue(ds: DataSource): Promise<number> {
  return ds.transaction(async (m) => {
    const existing = new Set((await m.find(Descriptor, { select: { code: true } })).map((d) => d.code));
    const characterIds = new Map((await m.find(Character, { select: { id: true, code: true } })).map((c) => [c.code, c.id]));
    const missing = DESCRIPTOR_CATALOGUE.filter((d) => !existing.has(d.code)).map(({ characterCode, ...d }) => ({
      ...d,
      sortOrder: walkOrderOf(d.code, (DESCRIPTOR_CATALOGUE.findIndex((x) => x.code === d.code) + 1) * 10),
      characterId: characterCode ? (characterIds.get(characterCode) ?? null) : null,
      active: true,
    }));
    if (missing.length) {
      await m.insert(Descriptor, missing);
      await recordAudit(m, SYSTEM, 'descriptors.seeded', null, { added: missing.map((d) => d.code) });
    }
    return missing.length;
  });
}

import type { DataSource } from 'typeorm';
import { recordAudit, SYSTEM } from '../audit/audit.js';
import { CHARACTER_CATALOGUE } from './character-catalogue.js';
import { Character } from './character.entity.js';

/**
 * Adds every catalogue character whose code is not in the database yet (admins' own characters
 * and edits are left alone). Runs at every start; returns how many were added.
 */
export async function seedCharacterCatalogue(ds: DataSource): Promise<number> {
  return ds.transaction(async (m) => {
    const existing = new Set((await m.find(Character, { select: { code: true } })).map((c) => c.code));
    const missing = CHARACTER_CATALOGUE.map((c, i) => ({ ...c, sortOrder: (i + 1) * 10, active: true })).filter((c) => !existing.has(c.code));
    if (missing.length) {
      await m.insert(Character, missing);
      await recordAudit(m, SYSTEM, 'catalogue.seeded', null, { added: missing.map((c) => c.code) });
    }
    return missing.length;
  });
}

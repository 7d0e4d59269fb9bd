import type { DataSource } from 'typeorm';
import type { Character as CharacterDto, CreateCharacterBody, UpdateCharacterBody } from '../../shared/api/collection.js';
import { DEFAULT_DRIFT_THRESHOLD } from '../../shared/api/collection-answers.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Descriptor } from './descriptor.entity.js';
import { Character, toCharacterDto } from './character.entity.js';

/** Adds a character to the catalogue, after the seeded ones; 409 for a taken code. */
export async function createCharacter(ds: DataSource, actor: Actor, body: CreateCharacterBody): Promise<CharacterDto> {
  return ds.transaction(async (m) => {
    if (await m.existsBy(Character, { code: body.code })) throw new AppError(409, 'Conflict', `A character ${body.code} already exists.`, [{ field: 'code', message: `is taken: a character ${body.code} already exists` }]);
    // New entries join the end of the walk, which both catalogues share.
    const last = [...(await m.find(Character, { order: { sortOrder: 'DESC' }, take: 1 })), ...(await m.find(Descriptor, { order: { sortOrder: 'DESC' }, take: 1 }))].sort((a, b) => b.sortOrder - a.sortOrder);
    const character = await m.save(
      m.create(Character, {
        code: body.code,
        organ: body.organ,
        label: body.label,
        howToRead: body.howToRead,
        caution: body.caution || null,
        colour: body.colour ?? true,
        active: true,
        sortOrder: (last[0]?.sortOrder ?? 0) + 10,
        driftThreshold: body.driftThreshold ?? DEFAULT_DRIFT_THRESHOLD,
      }),
    );
    await recordAudit(m, actor, 'character.created', `character:${character.id}`, { code: character.code, organ: character.organ });
    return toCharacterDto(character);
  });
}

/**
 * Changes a character's words, caution, drift threshold or whether it is offered. The start-up
 * seed only adds missing codes, so these edits hold for seeded characters too.
 */
export async function updateCharacter(ds: DataSource, actor: Actor, id: number, body: UpdateCharacterBody): Promise<CharacterDto> {
  return ds.transaction(async (m) => {
    const character = await m.findOneBy(Character, { id });
    if (!character) throw AppError.notFound(`No character ${id}.`);
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    for (const key of ['label', 'howToRead', 'caution', 'active', 'driftThreshold'] as const) {
      // An empty caution clears it.
      const value = key === 'caution' && body.caution === '' ? null : body[key];
      if (value === undefined || value === character[key]) continue;
      changes[key] = { from: character[key], to: value };
      Object.assign(character, { [key]: value });
    }
    if (Object.keys(changes).length) {
      await m.save(character);
      await recordAudit(m, actor, 'character.updated', `character:${id}`, changes);
    }
    return toCharacterDto(character);
  });
}

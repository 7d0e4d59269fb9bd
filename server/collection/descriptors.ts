import type { DataSource } from 'typeorm';
import type { CreateDescriptorBody, Descriptor as DescriptorDto, UpdateDescriptorBody } from '../../shared/api/descriptors.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Character } from './character.entity.js';
import { Descriptor, toDescriptorDto } from './descriptor.entity.js';

/** The descriptor catalogue in catalogue order. */
export async function listDescriptors(ds: DataSource): Promise<DescriptorDto[]> {
  const rows = await ds.getRepository(Descriptor).find({ order: { sortOrder: 'ASC', id: 'ASC' } });
  return rows.map(toDescriptorDto);
}

/** Adds a descriptor; 409 for a taken code; a ratio's parts must exist and measure the same kind. */
export async function createDescriptor(ds: DataSource, actor: Actor, body: CreateDescriptorBody): Promise<DescriptorDto> {
  return ds.transaction(async (m) => {
    if (await m.existsBy(Descriptor, { code: body.code })) throw new AppError(409, 'Conflict', `A descriptor ${body.code} already exists.`, [{ field: 'code', message: `is taken: a descriptor ${body.code} already exists` }]);
    if (body.kind === 'ratio') {
      const parts = [];
      for (const field of ['numeratorCode', 'denominatorCode'] as const) {
        const code = body[field]!;
        const part = await m.findOneBy(Descriptor, { code });
        if (!part) throw AppError.badRequest(`No descriptor ${code}.`, [{ field, message: `descriptor ${code} does not exist` }]);
        if (part.kind !== 'length' && part.kind !== 'mass' && part.kind !== 'count') {
          throw AppError.badRequest(`${code} is a ${part.kind}.`, [{ field, message: 'must be a length, mass or count descriptor' }]);
        }
        parts.push(part);
      }
      if (parts[0]!.kind !== parts[1]!.kind) {
        throw AppError.badRequest('A ratio divides like by like.', [{ field: 'denominatorCode', message: `is a ${parts[1]!.kind} but the numerator is a ${parts[0]!.kind}` }]);
      }
    }
    // New entries join the end of the walk, which both catalogues share.
    const last = [...(await m.find(Descriptor, { order: { sortOrder: 'DESC' }, take: 1 })), ...(await m.find(Character, { order: { sortOrder: 'DESC' }, take: 1 }))].sort((a, b) => b.sortOrder - a.sortOrder);
    const descriptor = await m.save(
      m.create(Descriptor, {
        code: body.code,
        label: body.label,
        object: body.object,
        kind: body.kind,
        categories: body.categories ?? [],
        numeratorCode: body.numeratorCode ?? null,
        denominatorCode: body.denominatorCode ?? null,
        howToMeasure: body.howToMeasure,
        caution: body.caution || null,
        active: true,
        sortOrder: (last[0]?.sortOrder ?? 0) + 10,
      }),
    );
    await recordAudit(m, actor, 'descriptor.created', `descriptor:${descriptor.id}`, { code: descriptor.code, kind: descriptor.kind });
    return toDescriptorDto(descriptor);
  });
}

/** Changes a descriptor's words, caution, categories (relabel or add, never remove) or whether it is offered. */
export async function updateDescriptor(ds: DataSource, actor: Actor, id: number, body: UpdateDescriptorBody): Promise<DescriptorDto> {
  return ds.transaction(async (m) => {
    const descriptor = await m.findOneBy(Descriptor, { id });
    if (!descriptor) throw AppError.notFound(`No descriptor ${id}.`);
    if (body.categories !== undefined) {
      if (descriptor.kind !== 'category') throw AppError.badRequest('Only a category descriptor has categories.', [{ field: 'categories', message: `${descriptor.code} is a ${descriptor.kind}` }]);
      const kept = new Set(body.categories.map((c) => c.id));
      const dropped = descriptor.categories.filter((c) => !kept.has(c.id)).map((c) => c.id);
      if (dropped.length) throw AppError.badRequest('Categories are never removed.', [{ field: 'categories', message: `must still hold ${dropped.join(', ')}: observations keep category ids` }]);
      if (body.categories.length < 2) throw AppError.badRequest('Too few categories.', [{ field: 'categories', message: 'a category descriptor needs at least two categories' }]);
    }
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    for (const key of ['label', 'object', 'howToMeasure', 'caution', 'active', 'categories'] as const) {
      const value = key === 'caution' && body.caution === '' ? null : body[key];
      if (value === undefined || JSON.stringify(value) === JSON.stringify(descriptor[key])) continue;
      changes[key] = { from: descriptor[key], to: value };
      Object.assign(descriptor, { [key]: value });
    }
    if (Object.keys(changes).length) {
      await m.save(descriptor);
      await recordAudit(m, actor, 'descriptor.updated', `descriptor:${id}`, changes);
    }
    return toDescriptorDto(descriptor);
  });
}

import type { DataSource, EntityManager } from 'typeorm';
import type { CreateSiteBody, ReplaceSeasonsBody, SavedSite, SeasonRange, Site as SiteDto, UpdateSiteBody } from '../../shared/api/collection.js';
import { checkSeasonScheme } from '../../shared/collection/season-scheme.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Season, Site, toSiteDto } from './site.entity.js';

/** One site with its seasons; 404 when there is none. */
export async function getSite(m: EntityManager, id: number): Promise<Site> {
  const site = await m.findOne(Site, { where: { id }, relations: { seasons: true } });
  if (!site) throw AppError.notFound(`No site ${id}.`);
  return site;
}

/** 409 naming the field when another site holds the code in any letter case ("rdp" beside "RDP"). */
async function assertCodeFree(m: EntityManager, code: string, exceptId?: number): Promise<void> {
  const holder = await m.createQueryBuilder(Site, 's').where('LOWER(s.code) = LOWER(:code)', { code }).getOne();
  if (holder && holder.id !== exceptId) {
    throw new AppError(409, 'Conflict', `A site ${holder.code} already exists; site codes are compared regardless of case.`, [
      { field: 'code', message: `is taken: a site ${holder.code} already exists (letter case does not count)` },
    ]);
  }
}

/** The scheme's warnings, after checking once more that it has no errors (the zod schema checks the same). */
function schemeWarnings(seasons: readonly SeasonRange[]): SavedSite['warnings'] {
  const check = checkSeasonScheme(seasons);
  if (!check.valid) throw AppError.badRequest('The season scheme is not valid.', check.errors.map((e) => ({ field: e.field, message: e.message })));
  return check.warnings;
}

/** Creates a site with its season scheme in one transaction; 409 for a taken code. */
export async function createSite(ds: DataSource, actor: Actor, body: CreateSiteBody): Promise<SavedSite> {
  const warnings = schemeWarnings(body.seasons);
  return ds.transaction(async (m) => {
    await assertCodeFree(m, body.code);
    const site = await m.save(
      m.create(Site, { code: body.code, name: body.name, timezone: body.timezone, latitude: body.latitude ?? null, longitude: body.longitude ?? null, elevationM: body.elevationM ?? null }),
    );
    site.seasons = [];
    for (const s of body.seasons) site.seasons.push(await m.save(m.create(Season, { site, name: s.name, start: s.start, end: s.end })));
    await recordAudit(m, actor, 'site.created', `site:${site.id}`, { code: site.code, seasons: body.seasons });
    return { ...toSiteDto(site), warnings };
  });
}

/** Changes a site's own fields (not its seasons); 404 unknown, 409 for a taken code. */
export async function updateSite(ds: DataSource, actor: Actor, id: number, body: UpdateSiteBody): Promise<SiteDto> {
  return ds.transaction(async (m) => {
    const site = await getSite(m, id);
    if (body.code !== undefined) await assertCodeFree(m, body.code, id);
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    for (const key of ['code', 'name', 'timezone', 'latitude', 'longitude', 'elevationM'] as const) {
      const value = body[key];
      if (value === undefined || value === site[key]) continue;
      changes[key] = { from: site[key], to: value };
      Object.assign(site, { [key]: value });
    }
    if (Object.keys(changes).length) {
      await m.update(Site, { id }, Object.fromEntries(Object.entries(changes).map(([k, v]) => [k, v.to])));
      await recordAudit(m, actor, 'site.updated', `site:${id}`, changes);
    }
    return toSiteDto(site);
  });
}

/**
 * Replaces a site's whole season scheme. Readings keep the season derived when they were
 * created, so this never rewrites the season of an earlier reading.
 */
export async function replaceSeasons(ds: DataSource, actor: Actor, id: number, body: ReplaceSeasonsBody): Promise<SavedSite> {
  const warnings = schemeWarnings(body.seasons);
  return ds.transaction(async (m) => {
    const site = await getSite(m, id);
    const before = toSiteDto(site).seasons.map(({ name, start, end }) => ({ name, start, end }));
    // A season kept under the same name keeps its row (and id); only seasons no longer named go.
    const byName = new Map(site.seasons.map((s) => [s.name.trim().toLowerCase(), s]));
    const kept: Season[] = [];
    for (const s of body.seasons) {
      const row = byName.get(s.name.trim().toLowerCase());
      byName.delete(s.name.trim().toLowerCase());
      kept.push(await m.save(row ? Object.assign(row, { name: s.name, start: s.start, end: s.end }) : m.create(Season, { site, name: s.name, start: s.start, end: s.end })));
    }
    for (const gone of byName.values()) await m.delete(Season, { id: gone.id });
    site.seasons = kept;
    await recordAudit(m, actor, 'site.seasons.replaced', `site:${id}`, { from: before, to: body.seasons });
    return { ...toSiteDto(site), warnings };
  });
}

import type { DataSource } from 'typeorm';
import { recordAudit, SYSTEM } from '../audit/audit.js';
import { hashPassword } from '../auth/passwords.js';
import { User } from '../auth/user.entity.js';
import { Accession, Plant } from '../collection/accession.entity.js';
import { Season, Site } from '../collection/site.entity.js';
import { seedDemoCalibration } from './demo-calibration.js';
import { seedDemoObservations } from './demo-observations.js';
import { seedDemoReadings } from './demo-readings.js';
import { seedDemoReviews } from './demo-reviews.js';
import { DEMO_ACCESSIONS, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SITES } from './demo-scenario.js';

/**
 * Loads the invented demo scenario (sites, seasons, accessions, plants, the four demo accounts)
 * into an empty database, in one transaction. Does nothing when any user exists.
 * Returns whether it loaded.
 */
export async function seedDemo(ds: DataSource): Promise<boolean> {
  if ((await ds.getRepository(User).count()) > 0) return false;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await ds.transaction(async (m) => {
    for (const p of DEMO_PEOPLE) {
      await m.insert(User, { email: p.email, name: p.name, role: p.role, passwordHash, active: true, lastLoginAt: null });
    }
    const sites = new Map<string, Site>();
    for (const s of DEMO_SITES) {
      const site = await m.save(m.create(Site, { code: s.code, name: s.name, timezone: s.timezone, latitude: s.latitude, longitude: s.longitude, elevationM: s.elevationM }));
      for (const season of s.seasons) await m.insert(Season, { ...season, site });
      sites.set(s.code, site);
    }
    for (const a of DEMO_ACCESSIONS) {
      const { siteCode, plants, ...passport } = a;
      const accession = await m.save(m.create(Accession, { ...passport, site: sites.get(siteCode)! }));
      for (const p of plants) {
        await m.insert(Plant, { accession, site: sites.get(p.siteCode ?? siteCode)!, label: p.label, plantedOn: p.plantedOn });
      }
    }
    await seedDemoCalibration(m, passwordHash);
    await seedDemoObservations(m);
    await seedDemoReadings(m);
    await seedDemoReviews(m);
    await recordAudit(m, SYSTEM, 'demo.loaded', null, { sites: DEMO_SITES.length, accessions: DEMO_ACCESSIONS.length, users: DEMO_PEOPLE.length });
  });
  return true;
}

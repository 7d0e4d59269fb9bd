// A small invented collection for the readings tests: two sites with season schemes, two
// accessions with plants, the seeded character catalogue. Everything is made through the API.
import type { Accession, Character, Site } from '../../shared/api/collection.js';
import type { CreateReadingRequest } from '../../shared/api/reading-answers.js';
import type { Client } from './harness.js';

/** The fixture rows the readings tests refer to. */
export interface ReadingWorld {
  /** Pacific/Fiji, Wet 11-01…04-30 (wraps the year end), Dry 05-01…10-31. */
  wetDry: Site;
  /** America/Port_of_Spain, Dry 01-01…05-31, Wet 06-01…12-31. */
  coast: Site;
  /** At wetDry; plants P1 (planted 2025-01-20 at wetDry) and P2 (2025-06-02 at coast). */
  violet: Accession;
  /** At coast; plant P1 (2025-03-17). */
  amber: Accession;
  characters: Map<string, Character>;
}

/** Builds the fixture collection as the admin. */
export async function readingWorld(admin: Client, suffix = ''): Promise<ReadingWorld> {
  const site = async (body: object) => (await admin.post('/api/sites', body).expect(201)).body as Site;
  const wetDry = await site({ code: `RWD${suffix}`, name: 'Reading Test Plot', timezone: 'Pacific/Fiji', seasons: [{ name: 'Wet', start: '11-01', end: '04-30' }, { name: 'Dry', start: '05-01', end: '10-31' }] });
  const coast = await site({ code: `RCG${suffix}`, name: 'Reading Test Garden', timezone: 'America/Port_of_Spain', seasons: [{ name: 'Dry', start: '01-01', end: '05-31' }, { name: 'Wet', start: '06-01', end: '12-31' }] });
  const accession = async (body: object) => (await admin.post('/api/accessions', body).expect(201)).body as Accession;
  const violet = await accession({ accessionNumber: `RT-V${suffix}`, name: 'Test Violet', siteId: wetDry.id, plants: [{ label: 'P1', plantedOn: '2025-01-20' }, { label: 'P2', plantedOn: '2025-06-02', siteId: coast.id }] });
  const amber = await accession({ accessionNumber: `RT-A${suffix}`, name: 'Test Amber', siteId: coast.id, plants: [{ label: 'P1', plantedOn: '2025-03-17' }] });
  const characters = new Map(((await admin.get('/api/characters').expect(200)).body as Character[]).map((c) => [c.code, c]));
  return { wetDry, coast, violet, amber, characters };
}

/** An instrument reading of the first plant of `violet`, petiole upper third, in open shade; override any field. */
export function instrumentBody(w: ReadingWorld, over: Partial<CreateReadingRequest> = {}): CreateReadingRequest {
  return {
    accessionId: w.violet.id,
    plantId: w.violet.plants[0]!.id,
    characterId: w.characters.get('petiole.third.upper')!.id,
    observedAt: '2026-02-10T09:30:00+12:00',
    method: 'instrument',
    lab: [38.2, 24.5, -12.1],
    instrument: 'Bench spectro A',
    light: 'open-shade',
    ...over,
  };
}

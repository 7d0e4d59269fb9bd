// Invented collection records for the Record specs (no real varieties, places or people).
import type { Accession, Character, Site } from '../../../../shared/api/collection-answers.js';

export const TEST_SITES: Site[] = [
  { id: 1, code: 'RDP', name: 'Rellowmere Demonstration Plot', timezone: 'Pacific/Fiji', latitude: null, longitude: null, elevationM: null, seasons: [{ id: 1, name: 'Wet', start: '11-01', end: '04-30' }] },
  { id: 2, code: 'HTG', name: 'Hobbenvale Trial Garden', timezone: 'Asia/Bangkok', latitude: null, longitude: null, elevationM: null, seasons: [] },
];

/** An invented accession with empty passport fields; `overrides` sets what a spec needs. */
export function testAccession(overrides: Partial<Accession> & Pick<Accession, 'id' | 'accessionNumber' | 'name'>): Accession {
  return {
    otherNames: [],
    instituteCode: null,
    genus: 'Colocasia',
    species: 'esculenta',
    speciesAuthor: '(L.) Schott',
    cropName: 'taro',
    originCountry: null,
    collectingSite: null,
    collectingLatitude: null,
    collectingLongitude: null,
    collectingElevationM: null,
    acquisitionDate: null,
    sampleStatus: null,
    donorName: null,
    remarks: null,
    siteId: 1,
    plants: [],
    ...overrides,
  };
}

export const TEST_ACCESSIONS: Accession[] = [
  testAccession({
    id: 1,
    accessionNumber: 'HL-0001',
    name: 'Purple Dawn',
    plants: [
      { id: 11, accessionId: 1, siteId: 1, label: 'P1', plantedOn: '2025-01-20' },
      { id: 12, accessionId: 1, siteId: 2, label: 'P2', plantedOn: '2025-06-02' },
    ],
  }),
];

const CAUTION = 'Wear gloves and never taste raw tissue.';

export const TEST_CHARACTERS: Character[] = [
  { id: 5, code: 'petiole.third.upper', organ: 'petiole', label: 'Petiole, upper third', howToRead: 'Read the outer face below the blade.', caution: null, colour: true, active: true, driftThreshold: 1.8, sortOrder: 300 },
  { id: 7, code: 'corm.flesh.centre', organ: 'corm', label: 'Corm flesh, centre', howToRead: 'Cut lengthwise; read the centre within a minute.', caution: CAUTION, colour: true, active: true, driftThreshold: 1.8, sortOrder: 500 },
];

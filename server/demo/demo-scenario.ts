/*
 * Invented scenario for the demo only; no real people, places or varieties.
 *
 * Site names, place names, variety names, donors and people are made up, and the sites carry no
 * coordinates, so none of them points at a real place. Time zones and ISO 3166-1 alpha-3 country
 * codes are real, because the app computes with them. Passport fields
 * follow the FAO/Bioversity Multi-Crop Passport Descriptors V.2.1 (Alercia, Diulgheroff &
 * Mackay 2015); the MCPD tag is named beside each field of DemoAccession.
 */

/** The one password every demo account signs in with. */
export const DEMO_PASSWORD = 'demo-pass-2026';

/** A demo account, one for each role. */
export interface DemoPerson {
  email: string;
  name: string;
  role: 'admin' | 'trainer' | 'reviewer' | 'recorder';
}

export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'admin@demo.test', name: 'Wren Hallowquist', role: 'admin' },
  { email: 'trainer@demo.test', name: 'Odile Marchenvey', role: 'trainer' },
  { email: 'reviewer@demo.test', name: 'Caspar Thistlequen', role: 'reviewer' },
  { email: 'recorder@demo.test', name: 'Juno Pellbright', role: 'recorder' },
];

/** A named season as a month-day range. */
export interface DemoSeason {
  name: string;
  /** "MM-DD", inclusive. */
  start: string;
  /** "MM-DD", inclusive; before start when the season wraps the year end. */
  end: string;
}

/** A demo site; its seasons cover every day of the year exactly once. */
export interface DemoSite {
  code: string;
  name: string;
  /** IANA time zone. */
  timezone: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  seasons: DemoSeason[];
}

/*
 * Season boundaries avoid the end of February, so a leap day falls inside a season rather than
 * on an edge that only exists in some years.
 */
export const DEMO_SITES: readonly DemoSite[] = [
  {
    code: 'RDP',
    name: 'Rellowmere Demonstration Plot',
    timezone: 'Pacific/Fiji',
    latitude: null,
    longitude: null,
    elevationM: 14,
    seasons: [
      { name: 'Wet', start: '11-01', end: '04-30' },
      { name: 'Dry', start: '05-01', end: '10-31' },
    ],
  },
  {
    code: 'HTG',
    name: 'Hobbenvale Trial Garden',
    timezone: 'Asia/Bangkok',
    latitude: null,
    longitude: null,
    elevationM: 640,
    seasons: [
      { name: 'Cool', start: '10-16', end: '02-15' },
      { name: 'Hot', start: '02-16', end: '05-15' },
      { name: 'Rainy', start: '05-16', end: '10-15' },
    ],
  },
  {
    code: 'LVS',
    name: 'Lummerdown Valley Station',
    timezone: 'Africa/Lagos',
    latitude: null,
    longitude: null,
    elevationM: 96,
    seasons: [
      { name: 'Dry', start: '11-01', end: '03-31' },
      { name: 'Early rains', start: '04-01', end: '07-31' },
      { name: 'Late rains', start: '08-01', end: '10-31' },
    ],
  },
  {
    code: 'CCG',
    name: 'Cindlecove Collection Garden',
    timezone: 'America/Port_of_Spain',
    latitude: null,
    longitude: null,
    elevationM: null,
    seasons: [
      { name: 'Dry', start: '01-01', end: '05-31' },
      { name: 'Wet', start: '06-01', end: '12-31' },
    ],
  },
];

/** A plant of a demo accession; it grows at the accession's site unless siteCode says otherwise. */
export interface DemoPlant {
  label: string;
  /** "YYYY-MM-DD". */
  plantedOn: string;
  siteCode?: string;
}

/** A demo accession with its passport fields and plants. */
export interface DemoAccession {
  /** ACCENUMB */
  accessionNumber: string;
  /** ACCENAME (first name) */
  name: string;
  /** ACCENAME (further names) */
  otherNames: string[];
  /** INSTCODE */
  instituteCode: string | null;
  /** ORIGCTY, ISO 3166-1 alpha-3 */
  originCountry: string | null;
  /** COLLSITE */
  collectingSite: string | null;
  /** DECLATITUDE, DECLONGITUDE, ELEVATION of where it was collected (invented), when known. */
  collectingLatitude?: number;
  collectingLongitude?: number;
  collectingElevationM?: number;
  /** ACQDATE, "YYYYMMDD" with hyphens for unknown parts */
  acquisitionDate: string | null;
  /** SAMPSTAT: 300 traditional cultivar/landrace, 400 breeding material, 500 advanced cultivar */
  sampleStatus: number | null;
  /** DONORNAME */
  donorName: string | null;
  /** REMARKS */
  remarks: string | null;
  siteCode: string;
  plants: DemoPlant[];
}

/*
 * Invented institute codes. Real INSTCODEs begin with the holder's ISO 3166-1 alpha-3 country;
 * codes starting with "X" are left for user assignment by ISO 3166-1, so these cannot name a real
 * institute.
 */
const DEMO_GENEBANK = 'XHL001';
const DEMO_NURSERY = 'XHL002';

export const DEMO_ACCESSIONS: readonly DemoAccession[] = [
  {
    accessionNumber: 'HL-0001',
    name: 'Violet Stripe',
    otherNames: ['Purple Bar'],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'FJI',
    collectingSite: 'Home garden beside the upper ford, Quorrish Creek valley',
    acquisitionDate: '20240312',
    sampleStatus: 300,
    donorName: 'Mara Quillfeather',
    remarks: 'Petiole stripes look paler late in the dry season.',
    siteCode: 'RDP',
    plants: [
      { label: 'P1', plantedOn: '2025-01-20' },
      { label: 'P2', plantedOn: '2025-01-20' },
      { label: 'P3', plantedOn: '2025-06-02', siteCode: 'HTG' },
    ],
  },
  {
    accessionNumber: 'HL-0002',
    name: 'Cream Heart',
    otherNames: [],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'FJI',
    collectingSite: 'Roadside plot near Fallowquern Landing',
    acquisitionDate: '2023----',
    sampleStatus: 300,
    donorName: 'Mara Quillfeather',
    remarks: null,
    siteCode: 'RDP',
    plants: [
      { label: 'P1', plantedOn: '2025-02-11' },
      { label: 'P2', plantedOn: '2025-09-15' },
    ],
  },
  {
    accessionNumber: 'HL-0003',
    name: 'Dusk Ring',
    otherNames: ['Dark Collar', 'Ring 7'],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'WSM',
    collectingSite: null,
    acquisitionDate: '202406--',
    sampleStatus: 300,
    donorName: 'Dunquillow Growers Circle',
    remarks: 'Dark basal ring; compare across sites.',
    siteCode: 'RDP',
    plants: [
      { label: 'P1', plantedOn: '2025-03-04' },
      { label: 'P2', plantedOn: '2025-03-04', siteCode: 'LVS' },
      { label: 'P3', plantedOn: '2026-01-12' },
    ],
  },
  {
    accessionNumber: 'HL-0004',
    name: 'Copper Vein',
    otherNames: [],
    instituteCode: DEMO_NURSERY,
    originCountry: 'THA',
    collectingSite: 'Terrace garden on the north slope above Tessivane',
    acquisitionDate: '20240827',
    sampleStatus: 300,
    donorName: 'Tobiah Fenmarch',
    remarks: null,
    siteCode: 'HTG',
    plants: [
      { label: 'P1', plantedOn: '2025-04-18' },
      { label: 'P2', plantedOn: '2025-04-18' },
    ],
  },
  {
    accessionNumber: 'HL-0005',
    name: 'Velmora',
    otherNames: ['Velmora Tall'],
    instituteCode: DEMO_NURSERY,
    originCountry: 'VNM',
    collectingSite: null,
    acquisitionDate: '2024----',
    sampleStatus: 400,
    donorName: 'Hobbenvale Trial Garden breeding team',
    remarks: 'Breeding line kept for its pink corm flesh.',
    siteCode: 'HTG',
    plants: [
      { label: 'P1', plantedOn: '2025-05-06' },
      { label: 'P2', plantedOn: '2025-11-20' },
      { label: 'P3', plantedOn: '2025-11-20' },
      { label: 'P4', plantedOn: '2026-05-14' },
    ],
  },
  {
    accessionNumber: 'HL-0006',
    name: 'Snow Core',
    otherNames: [],
    instituteCode: null,
    originCountry: 'PHL',
    collectingSite: 'Market garden at Marrowdyne Crossing',
    acquisitionDate: '20250107',
    sampleStatus: 500,
    donorName: 'Tobiah Fenmarch',
    remarks: null,
    siteCode: 'HTG',
    plants: [
      { label: 'P1', plantedOn: '2025-02-25' },
      { label: 'P2', plantedOn: '2025-08-09', siteCode: 'CCG' },
    ],
  },
  {
    accessionNumber: 'HL-0007',
    name: 'Rust Collar',
    otherNames: ['Red Base'],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'NGA',
    collectingSite: 'Wetland edge below Yarrowquist',
    acquisitionDate: '202311--',
    sampleStatus: 300,
    donorName: 'Eluned Brackwillow',
    remarks: 'Sheath edge reddens in the early rains.',
    siteCode: 'LVS',
    plants: [
      { label: 'P1', plantedOn: '2025-04-02' },
      { label: 'P2', plantedOn: '2025-04-02' },
      { label: 'P3', plantedOn: '2025-10-21' },
    ],
  },
  {
    accessionNumber: 'HL-0008',
    name: 'Quennet',
    otherNames: [],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'GHA',
    collectingSite: null,
    acquisitionDate: null,
    sampleStatus: null,
    donorName: null,
    remarks: 'Passport details not yet traced.',
    siteCode: 'LVS',
    plants: [
      { label: 'P1', plantedOn: '2025-07-15' },
      { label: 'P2', plantedOn: '2026-03-30' },
    ],
  },
  {
    accessionNumber: 'HL-0009',
    name: 'Plum Shadow',
    otherNames: ['Shadow Leaf'],
    instituteCode: DEMO_NURSERY,
    originCountry: 'CMR',
    collectingSite: 'Farm garden on the Orrelbane road',
    acquisitionDate: '20240519',
    sampleStatus: 300,
    donorName: 'Eluned Brackwillow',
    remarks: null,
    siteCode: 'LVS',
    plants: [
      { label: 'P1', plantedOn: '2025-08-26' },
      { label: 'P2', plantedOn: '2025-08-26', siteCode: 'RDP' },
    ],
  },
  {
    accessionNumber: 'HL-0010',
    name: 'Amber Sheath',
    otherNames: [],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'TTO',
    collectingSite: 'Backyard plot at Skellivan Bay',
    acquisitionDate: '20250210',
    sampleStatus: 300,
    donorName: 'Corwin Saltervane',
    remarks: null,
    siteCode: 'CCG',
    plants: [
      { label: 'P1', plantedOn: '2025-03-17' },
      { label: 'P2', plantedOn: '2025-03-17' },
      { label: 'P3', plantedOn: '2026-06-08' },
    ],
  },
  {
    accessionNumber: 'HL-0011',
    name: 'Brindal',
    otherNames: ['Brindal Green'],
    instituteCode: null,
    originCountry: 'JAM',
    collectingSite: null,
    acquisitionDate: '2025----',
    sampleStatus: 400,
    donorName: 'Cindlecove Collection Garden seedling trial',
    remarks: 'Seedling selection; leaf margin colour still variable between plants.',
    siteCode: 'CCG',
    plants: [
      { label: 'P1', plantedOn: '2025-10-03' },
      { label: 'P2', plantedOn: '2026-09-01' },
    ],
  },
  {
    accessionNumber: 'HL-0012',
    name: 'Lilac Edge',
    otherNames: [],
    instituteCode: DEMO_GENEBANK,
    originCountry: 'PNG',
    collectingSite: 'Hamlet garden past the Vessinmoor bend',
    acquisitionDate: '20240930',
    sampleStatus: 500,
    donorName: 'Corwin Saltervane',
    remarks: null,
    siteCode: 'CCG',
    plants: [
      { label: 'P1', plantedOn: '2025-01-28' },
      { label: 'P2', plantedOn: '2025-12-05', siteCode: 'RDP' },
    ],
  },
  {
    // The planted duplicate: the same invented variety as HL-0004 "Copper Vein", received again
    // under the same donor's own name. Its readings and measurements follow HL-0004's, so the look-alike
    // page can find it (see DEMO_DUPLICATE).
    accessionNumber: 'HL-0013',
    name: 'Ember Thread',
    otherNames: [],
    instituteCode: DEMO_NURSERY,
    originCountry: 'THA',
    collectingSite: 'Kitchen garden below the Tessivane terraces',
    acquisitionDate: '20250305',
    sampleStatus: 300,
    donorName: 'Tobiah Fenmarch',
    remarks: 'Donor\'s own name for it; not yet compared with the rest of the collection.',
    siteCode: 'HTG',
    plants: [
      { label: 'P1', plantedOn: '2025-04-22' },
      { label: 'P2', plantedOn: '2025-04-22' },
    ],
  },
];

/** Two accession numbers of one invented variety, for the look-alike accessions to find. */
export const DEMO_DUPLICATE = { accessionNumber: 'HL-0013', sameAs: 'HL-0004' } as const;

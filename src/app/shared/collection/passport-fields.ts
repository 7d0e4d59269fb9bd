/**
 * Our labels for the passport fields, each with its FAO/Bioversity Multi-Crop Passport Descriptors
 * V.2.1 name (Alercia, Diulgheroff & Mackay 2015) shown small beside it, so a genebank curator
 * can see where each value goes in an MCPD file.
 */
export const PASSPORT_LABELS = {
  accessionNumber: { label: 'Accession number', mcpd: 'ACCENUMB' },
  name: { label: 'Name', mcpd: 'ACCENAME' },
  otherNames: { label: 'Other names', mcpd: 'ACCENAME' },
  instituteCode: { label: 'Holding institute code', mcpd: 'INSTCODE' },
  genus: { label: 'Genus', mcpd: 'GENUS' },
  species: { label: 'Species', mcpd: 'SPECIES' },
  speciesAuthor: { label: 'Species authority', mcpd: 'SPAUTHOR' },
  cropName: { label: 'Crop', mcpd: 'CROPNAME' },
  originCountry: { label: 'Country of origin', mcpd: 'ORIGCTY' },
  collectingSite: { label: 'Where it was collected', mcpd: 'COLLSITE' },
  collectingLatitude: { label: 'Collecting latitude (decimal °, −90 to 90)', mcpd: 'DECLATITUDE' },
  collectingLongitude: { label: 'Collecting longitude (decimal °, −180 to 180)', mcpd: 'DECLONGITUDE' },
  collectingElevationM: { label: 'Collecting elevation (m)', mcpd: 'ELEVATION' },
  acquisitionDate: { label: 'Acquired', mcpd: 'ACQDATE' },
  sampleStatus: { label: 'Biological status', mcpd: 'SAMPSTAT' },
  donorName: { label: 'Donor', mcpd: 'DONORNAME' },
  remarks: { label: 'Remarks', mcpd: 'REMARKS' },
} as const;

/** A passport field of ours. */
export type PassportField = keyof typeof PASSPORT_LABELS;

/**
 * The MCPD biological status codes a taro collection meets most (MCPD V.2.1, SAMPSTAT), in our
 * own short words; other codes are shown by number.
 */
export const SAMPLE_STATUSES: readonly { code: number; words: string }[] = [
  { code: 100, words: 'wild' },
  { code: 200, words: 'weedy' },
  { code: 300, words: 'traditional cultivar or landrace' },
  { code: 400, words: 'breeding or research material' },
  { code: 500, words: 'advanced or improved cultivar' },
  { code: 999, words: 'other' },
];

/** A SAMPSTAT code in words ("300 · traditional cultivar or landrace"). */
export function sampleStatusWords(code: number | null): string | null {
  if (code === null) return null;
  const known = SAMPLE_STATUSES.find((status) => status.code === code);
  return known ? `${code} · ${known.words}` : String(code);
}

/** An MCPD date "YYYYMMDD" (hyphens for unknown parts) in words: "March 2019", "2019", "4 March 2019". */
export function mcpdDateWords(value: string | null): string | null {
  if (!value) return null;
  const match = /^(\d{4})(\d{2}|--)(\d{2}|--)$/.exec(value);
  if (!match) return value;
  const [, year, month, day] = match;
  if (month === '--') return year;
  const monthName = new Date(Date.UTC(2000, Number(month) - 1, 1)).toLocaleString('en', { month: 'long', timeZone: 'UTC' });
  return day === '--' ? `${monthName} ${year}` : `${Number(day)} ${monthName} ${year}`;
}

/** Whole months from a planting date to a day, as plant age is counted for readings ("7 months"). */
export function plantAgeMonths(plantedOn: string, today: Date = new Date()): number | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(plantedOn);
  if (!match) return null;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  let months = (today.getFullYear() - year) * 12 + (today.getMonth() + 1 - month);
  if (today.getDate() < day) months--;
  return months < 0 ? null : months;
}

/** Plant age in words: "not yet planted", "under a month", "1 month", "14 months (1 y 2 m)". */
export function plantAgeWords(plantedOn: string, today: Date = new Date()): string {
  const months = plantAgeMonths(plantedOn, today);
  if (months === null) return 'not yet planted';
  if (months === 0) return 'under a month';
  if (months === 1) return '1 month';
  if (months < 12) return `${months} months`;
  return `${months} months (${Math.floor(months / 12)} y ${months % 12} m)`;
}

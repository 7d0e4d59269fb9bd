import type { Accession, Site } from '../../../../../shared/api/collection-answers.js';
import { testAccession } from '../../../shared/testing/collection-fixtures';
import { accessionRows, matchAccessions, seasonLabel, seasonsLabel, sortAccessions } from './collection-format';

const site: Site = {
  id: 7,
  code: 'NRV',
  name: 'North River plot',
  timezone: 'Pacific/Fiji',
  latitude: null,
  longitude: null,
  elevationM: null,
  seasons: [
    { id: 1, name: 'wet', start: '11-01', end: '04-30' },
    { id: 2, name: 'dry', start: '05-01', end: '10-31' },
  ],
};

function accession(id: number, accessionNumber: string, name: string, plants = 0): Accession {
  return testAccession({
    id,
    accessionNumber,
    name,
    otherNames: id === 1 ? ['Dusk Stem', 'Red Ring'] : [],
    siteId: 7,
    plants: Array.from({ length: plants }, (_, i) => ({ id: i, accessionId: id, siteId: 7, label: `P${i}`, plantedOn: '2025-01-01' })),
  });
}

describe('collection formatting', () => {
  it('should write a season as name, start and end', () => {
    expect(seasonLabel(site.seasons[0])).toBe('wet 11-01 → 04-30');
  });

  it('should join a site’s seasons', () => {
    expect(seasonsLabel(site.seasons)).toBe('wet 11-01 → 04-30; dry 05-01 → 10-31');
  });

  it('should say so when a site has no seasons', () => {
    expect(seasonsLabel([])).toBe('No seasons set');
  });

  it('should name the site and count plants of each accession', () => {
    const [row] = accessionRows([accession(1, 'HL-0001', 'Violet Vein', 3)], [site]);
    expect(row).toEqual(
      expect.objectContaining({ site: 'NRV · North River plot', otherNames: 'Dusk Stem; Red Ring', plantCount: 3 }),
    );
  });

  it('should find accessions by one of their other names', () => {
    const rows = accessionRows([accession(1, 'HL-0001', 'Violet Vein'), accession(2, 'HL-0002', 'Pale Corm')], [site]);
    expect(matchAccessions(rows, 'red ring').map((row) => row.id)).toEqual([1]);
  });

  it('should sort accession numbers in natural order', () => {
    const rows = accessionRows([accession(1, 'HL-10', 'A'), accession(2, 'HL-2', 'B')], [site]);
    expect(sortAccessions(rows, 'accessionNumber', 'asc').map((row) => row.accessionNumber)).toEqual(['HL-2', 'HL-10']);
  });

  it('should sort plant counts descending as numbers', () => {
    const rows = accessionRows([accession(1, 'A', 'A', 2), accession(2, 'B', 'B', 10)], [site]);
    expect(sortAccessions(rows, 'plantCount', 'desc').map((row) => row.plantCount)).toEqual([10, 2]);
  });
});

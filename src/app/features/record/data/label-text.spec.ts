import type { Accession } from '../../../../../shared/api/collection-answers.js';
import { testAccession } from '../../../shared/testing/collection-fixtures';
import { filterAccessions, readLabel } from './label-text';

/** Invented accessions, as the demo's: numbers that prefix one another on purpose. */
function accession(id: number, accessionNumber: string, name: string, plants: string[] = [], otherNames: string[] = []): Accession {
  return testAccession({ id, accessionNumber, name, otherNames, plants: plants.map((label, i) => ({ id: id * 10 + i, accessionId: id, siteId: 1, label, plantedOn: '2025-01-20' })) });
}

const LIST = [
  accession(1, 'HL-0001', 'Purple Dawn', ['P1', 'P2', 'P12']),
  accession(2, 'HL-00012', 'Long Stripe'),
  accession(3, 'HL-0003', 'Cream Heart', [], ['Milkcorm']),
];

describe('label text', () => {
  it('should choose the accession whose number is in the label, however it is spaced', () => {
    expect(readLabel('Accession HL 0001 row 4', LIST)?.accession.id).toBe(1);
    expect(readLabel('hl0003', LIST)?.accession.id).toBe(3);
  });

  it('should prefer the longer number when one number begins another', () => {
    expect(readLabel('HL-00012', LIST)?.accession.id).toBe(2);
  });

  it('should not read a number that runs on into more digits as a shorter one', () => {
    expect(readLabel('HL-00019', LIST)).toBeNull();
  });

  it('should pick the plant whose label follows the number, the longest first', () => {
    expect(readLabel('HL-0001 / P2', LIST)?.plant?.label).toBe('P2');
    expect(readLabel('HL-0001 P12', LIST)?.plant?.label).toBe('P12');
    expect(readLabel('HL-0001', LIST)?.plant).toBeNull();
  });

  it('should find nothing in text without an accession number', () => {
    expect(readLabel('row 4, bed 2', LIST)).toBeNull();
    expect(readLabel('   ', LIST)).toBeNull();
  });

  it('should filter by number first, then by any name', () => {
    expect(filterAccessions('0003', LIST).map((a) => a.id)).toEqual([3]);
    expect(filterAccessions('milk', LIST).map((a) => a.id)).toEqual([3]);
    expect(filterAccessions('hl 000', LIST).map((a) => a.id)).toEqual([1, 2, 3]);
    expect(filterAccessions('', LIST)).toHaveLength(3);
  });
});

import type { Descriptor } from '../../../../../shared/api/descriptor-answers.js';
import { categoryIdOf, KIND_WORDS, ratioParts } from './descriptor-words';

const base = { object: '', categories: [], howToMeasure: '', caution: null, active: true, sortOrder: 0, characterId: null };
const catalogue: Descriptor[] = [
  { ...base, id: 1, code: 'petiole.length', label: 'Petiole length', kind: 'length', numeratorCode: null, denominatorCode: null },
  { ...base, id: 2, code: 'sheath.length', label: 'Sheath length', kind: 'length', numeratorCode: null, denominatorCode: null },
  { ...base, id: 3, code: 'petiole.sheath.ratio', label: 'Ratio', kind: 'ratio', numeratorCode: 'petiole.length', denominatorCode: 'sheath.length' },
];

describe('descriptor words', () => {
  it('should name a ratio’s parts by their labels', () => {
    expect(ratioParts(catalogue[2], catalogue)).toBe('Petiole length ÷ Sheath length');
    expect(ratioParts(catalogue[0], catalogue)).toBeNull();
  });

  it('should say lengths are stored in metres', () => {
    expect(KIND_WORDS.length.units).toContain('metres');
  });

  it('should make a category id from a label as the server’s pattern wants', () => {
    expect(categoryIdOf('Long oval')).toBe('long-oval');
    expect(categoryIdOf('  Tip held above the join! ')).toBe('tip-held-above-the-join');
    expect(categoryIdOf('Café-crème')).toBe('cafe-creme');
  });
});

import { labD50ToD65 } from '../../../../../shared/colour/chromatic-adaptation.js';
import { ChipSet } from '../../../shared/chips/chip-catalogue';
import { TEST_CHIPS, TEST_SETS } from '../../../shared/testing/chip-fixtures';
import { provisionalChip, provisionalLab } from './provisional-chip';

describe('provisional chip', () => {
  const set = new ChipSet(TEST_SETS[0]!, TEST_CHIPS);
  const base = { accessionId: 1, characterId: 5, siteId: 1 };

  it('should match an instrument reading, a swatch and a photo preview against the chips on the phone', () => {
    expect(provisionalChip({ ...base, method: 'instrument', lab: [50, -40, 30], illuminant: 'D65/2' }, set)?.code).toBe('F-002');
    expect(provisionalChip({ ...base, method: 'photo', light: 'overcast' }, set, [45, 40, 20])?.code).toBe('F-001');
    expect(provisionalChip({ ...base, method: 'chip', chipCode: 'F-001.002', light: 'overcast' }, set)).toMatchObject({ code: 'F-001.002', deltaE00: 0 });
    expect(provisionalChip({ ...base, method: 'swatch', hex: '#7b3f6e', light: 'overcast' }, set)).not.toBeNull();
  });

  it('should adapt a D50/2° instrument reading as the server does before matching', () => {
    const lab = provisionalLab({ ...base, method: 'instrument', lab: [45, 40, 20], illuminant: 'D50/2' }, set, null);
    expect(lab).toEqual(labD50ToD65({ l: 45, a: 40, b: 20 }));
  });

  it('should give nothing without chips, or a photo without its preview', () => {
    expect(provisionalChip({ ...base, method: 'instrument', lab: [45, 40, 20] }, null)).toBeNull();
    expect(provisionalChip({ ...base, method: 'photo', light: 'overcast' }, set, null)).toBeNull();
  });
});

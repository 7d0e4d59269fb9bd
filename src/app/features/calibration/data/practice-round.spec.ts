import { inTissueRegion, TISSUE_REGIONS } from '../../../../../shared/colour/tissue-regions.js';
import { isInSrgbGamut } from '../../../../../shared/colour/display-hex.js';
import { labToLch } from '../../../../../shared/colour/lab.js';
import { practiceTarget } from './practice-round';

describe('practice targets', () => {
  it('should give the same colour for the same seed', () => {
    expect(practiceTarget(4242)).toEqual(practiceTarget(4242));
  });

  it('should draw different colours for different rounds', () => {
    const hexes = new Set(Array.from({ length: 20 }, (_, i) => practiceTarget(100 + i).hex));
    expect(hexes.size).toBeGreaterThan(15);
  });

  it('should draw every target from a tissue region and inside sRGB, naming its region', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const target = practiceTarget(seed);
      const region = TISSUE_REGIONS.find((r) => r.label === target.region)!;
      expect(region).toBeDefined();
      expect(inTissueRegion(labToLch(target.lab), region)).toBe(true);
      expect(isInSrgbGamut(target.lab)).toBe(true);
    }
  });
});

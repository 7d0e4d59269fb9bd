import { simulate, simulatedDistance } from './vision-simulation';

describe('colour-vision simulation', () => {
  it('should leave colours as they are for normal vision', () => {
    expect(simulate('#7b3f6e', 'normal').hex).toBe('#7b3f6e');
  });

  it('should leave greys alone for every deficiency (the model keeps neutrals neutral)', () => {
    for (const kind of ['protanopia', 'deuteranopia', 'tritanopia'] as const) expect(simulate('#808080', kind).hex).toBe('#808080');
  });

  it('should bring a red and a green of like lightness closer together for a deuteranope', () => {
    // Machado et al. (2009): red–green confusions are the mark of protan and deutan vision.
    const normal = simulatedDistance('#b5534a', '#6f8a3a', 'normal');
    const deutan = simulatedDistance('#b5534a', '#6f8a3a', 'deuteranopia');
    expect(deutan).toBeLessThan(normal / 2);
  });

  it('should change less at a lower severity', () => {
    const full = simulatedDistance('#b5534a', simulate('#b5534a', 'protanopia', 1).hex, 'normal');
    const mild = simulatedDistance('#b5534a', simulate('#b5534a', 'protanopia', 0.3).hex, 'normal');
    expect(mild).toBeLessThan(full);
    expect(mild).toBeGreaterThan(0);
  });
});

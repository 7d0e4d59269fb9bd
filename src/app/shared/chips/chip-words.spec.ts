import { betweenWords, chromaHueText, formatNumber, labText, normaliseCode } from './chip-words';

describe('chip words', () => {
  it('should write negative numbers with a true minus sign and no "−0.00"', () => {
    expect(formatNumber(-15.814, 2)).toBe('−15.81');
    expect(formatNumber(-0.001, 2)).toBe('0.00');
    expect(labText([35.776, 32.847, -15.8146])).toBe('L* 35.78, a* 32.85, b* −15.81');
    expect(chromaHueText([35.776, 36.456, 334.29])).toBe('C* 36.46, h° 334.3');
  });

  it('should say which chip a colour is nearer, or that it is about half-way', () => {
    expect(betweenWords({ a: 'F-087.014', b: 'F-087.015', t: 0.2 })).toBe('between F-087.014 and F-087.015, nearer F-087.014');
    expect(betweenWords({ a: 'F-087.014', b: 'F-087.015', t: 0.8 })).toBe('between F-087.014 and F-087.015, nearer F-087.015');
    expect(betweenWords({ a: 'F-087.014', b: 'F-087.015', t: 0.55 })).toBe('about half-way between F-087.014 and F-087.015');
  });

  it('should read codes the way people type them', () => {
    expect(normaliseCode('F-087')).toBe('F-087');
    expect(normaliseCode('f87')).toBe('F-087');
    expect(normaliseCode(' 87.14 ')).toBe('F-087.014');
    expect(normaliseCode('F-087.014')).toBe('F-087.014');
  });

  it('should refuse text that cannot be a code', () => {
    expect(normaliseCode('purple')).toBeNull();
    expect(normaliseCode('F-1234')).toBeNull();
    expect(normaliseCode('')).toBeNull();
  });
});

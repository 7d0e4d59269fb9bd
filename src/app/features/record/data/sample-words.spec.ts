import type { PhotoSample } from '../../../../../shared/api/photo-answers.js';
import { betweenWords, correctionWords, signed } from './sample-words';

describe('sample words', () => {
  it('should say which chip a reading is nearer', () => {
    expect(betweenWords({ a: 'F-010.002', b: 'F-010.003', t: 0.2 })).toBe('Between F-010.002 and F-010.003, nearer F-010.002.');
    expect(betweenWords({ a: 'F-010.002', b: 'F-010.003', t: 0.5 })).toBe('Between F-010.002 and F-010.003, about halfway.');
    expect(betweenWords({ a: 'F-010.002', b: 'F-010.003', t: 0.8 })).toBe('Between F-010.002 and F-010.003, nearer F-010.003.');
  });

  it('should write negative numbers with a true minus and no negative zero', () => {
    expect(signed(-12.34)).toBe('−12.3');
    expect(signed(-0.01)).toBe('0.0');
    expect(signed(5)).toBe('5.0');
  });

  it('should describe each kind of correction', () => {
    const base = { correction: { kind: 'none' } } as PhotoSample;
    expect(correctionWords(base)).toMatch(/No correction/);
    const neutral = { correction: { kind: 'neutral', gains: [1.1, 1, 0.9] } } as unknown as PhotoSample;
    expect(correctionWords(neutral)).toBe('Balanced on the grey card (gains 1.10 · 1.00 · 0.90).');
  });
});

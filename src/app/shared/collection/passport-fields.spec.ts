import { mcpdDateWords, PASSPORT_LABELS, plantAgeMonths, plantAgeWords, sampleStatusWords } from './passport-fields';

describe('passport fields', () => {
  it('should carry the MCPD V.2.1 names beside our labels', () => {
    expect(PASSPORT_LABELS.accessionNumber.mcpd).toBe('ACCENUMB');
    expect(PASSPORT_LABELS.originCountry.mcpd).toBe('ORIGCTY');
    expect(PASSPORT_LABELS.acquisitionDate.mcpd).toBe('ACQDATE');
  });

  it('should read MCPD dates with unknown parts as hyphens (MCPD V.2.1, ACQDATE)', () => {
    expect(mcpdDateWords('20190304')).toBe('4 March 2019');
    expect(mcpdDateWords('201903--')).toBe('March 2019');
    expect(mcpdDateWords('2019----')).toBe('2019');
    expect(mcpdDateWords(null)).toBeNull();
  });

  it('should name known biological status codes and show others by number', () => {
    expect(sampleStatusWords(300)).toBe('300 · traditional cultivar or landrace');
    expect(sampleStatusWords(410)).toBe('410');
    expect(sampleStatusWords(null)).toBeNull();
  });

  it('should count whole months of plant age, not rounding up before the day', () => {
    expect(plantAgeMonths('2025-01-15', new Date(2025, 6, 14))).toBe(5);
    expect(plantAgeMonths('2025-01-15', new Date(2025, 6, 15))).toBe(6);
    expect(plantAgeMonths('2026-01-01', new Date(2025, 6, 15))).toBeNull();
  });

  it('should put plant age in words', () => {
    expect(plantAgeWords('2025-07-01', new Date(2025, 6, 20))).toBe('under a month');
    expect(plantAgeWords('2024-05-01', new Date(2025, 6, 20))).toBe('14 months (1 y 2 m)');
    expect(plantAgeWords('2030-01-01', new Date(2025, 6, 20))).toBe('not yet planted');
  });
});

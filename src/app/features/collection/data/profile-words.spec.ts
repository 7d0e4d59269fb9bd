import type { CharacterProfile, DescriptorSummary, ProfilePhoto } from '../../../../../shared/api/profile-answers.js';
import { chipText, countsText, cropStyle, descriptorText, setChipText, stabilityText } from './profile-words';

const flag = (kind: 'season-drift' | 'site-difference') => ({ kind, label: 'x', deltaE00: 3, pValue: 0.001, reason: 'r' });

describe('profile words', () => {
  it('should say how many readings, observers and plants the colour rests on', () => {
    expect(countsText({ basis: 'current', nReadings: 8, nObservers: 2, nPlants: 1, nCurrent: 8 })).toBe('8 readings by 2 observers on 1 plant');
    expect(countsText({ basis: 'approved', nReadings: 1, nObservers: 1, nPlants: 0, nCurrent: 5 })).toBe('1 approved reading of 5 by 1 observer on 0 plants');
  });

  it('should name the chip with its ΔE00 and verdict', () => {
    const chip = { code: 'F-182.063', name: 'deep red-purple', hex: '#6a2050', deltaE00: 0.617, verdict: 'indistinguishable' as const };
    expect(chipText({ chip })).toBe('F-182.063 deep red-purple, ΔE00 0.62 (indistinguishable)');
  });

  it("should name each set's nearest chip, marking the current set and the one shown above", () => {
    const chip = { code: 'F-301.017', name: 'plum 40 · 22', hex: '#6a2050', deltaE00: 0.414, verdict: 'indistinguishable' as const };
    expect(setChipText({ setId: 'v2', current: true, shown: false, chip })).toBe('In set v2 (current): F-301.017 plum 40 · 22, ΔE00 0.41');
    expect(setChipText({ setId: 'v1', current: true, shown: true, chip })).toBe('In set v1 (current, shown above): F-301.017 plum 40 · 22, ΔE00 0.41');
    expect(setChipText({ setId: 'v1', current: false, shown: false, chip })).toBe('In set v1: F-301.017 plum 40 · 22, ΔE00 0.41');
  });

  it('should call a character steady when nothing is flagged, else count each kind of flag', () => {
    const base = { seasons: [{}, {}, {}], sites: [{}] } as unknown as Pick<CharacterProfile, 'flags' | 'seasons' | 'sites'>;
    expect(stabilityText({ ...base, flags: [] })).toBe('steady across 3 season groups and 1 site');
    expect(stabilityText({ ...base, flags: [flag('season-drift'), flag('season-drift'), flag('site-difference')] })).toBe('flagged: 2 season changes and 1 site difference within a season');
  });

  it('should give numbers as median and range in the chosen units, and categories as mode and count', () => {
    const length: DescriptorSummary = {
      descriptorId: 1, code: 'petiole.length', label: 'Petiole length', kind: 'length', n: 4, median: 1, min: 0.9, max: 1.1,
      formatted: { median: { metric: '100.0 cm', imperial: '39.4 in' }, min: { metric: '90.0 cm', imperial: '35.4 in' }, max: { metric: '110.0 cm', imperial: '43.3 in' } },
      mode: null, modeLabel: null, share: null,
    };
    expect(descriptorText(length, 'metric')).toBe('median 100.0 cm (90.0 cm – 110.0 cm, 4 plants)');
    expect(descriptorText(length, 'imperial')).toBe('median 39.4 in (35.4 in – 43.3 in, 4 plants)');
    const category: DescriptorSummary = { ...length, kind: 'category', median: null, min: null, max: null, formatted: null, mode: 'level', modeLabel: 'Level', share: 0.75 };
    expect(descriptorText(category, 'metric')).toBe('Level (3 of 4 plants)');
  });

  it('should scale the photo so the region fills the crop, centred on it', () => {
    const photo: ProfilePhoto = { readingId: 1, photoId: 2, width: 1000, height: 500, box: { x: 100, y: 200, width: 50, height: 25 }, deltaE00: 0.3 };
    // Longer side 50 px → 100 px: scale 2; the region's centre (125, 212.5) lands at the crop's centre (50, 50).
    expect(cropStyle(photo, 100)).toEqual({ backgroundSize: '2000.0px 1000.0px', backgroundPosition: '-200.0px -375.0px' });
  });
});

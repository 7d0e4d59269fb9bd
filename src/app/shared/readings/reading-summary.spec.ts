import { displayHex } from '../../../../shared/colour/display-hex.js';
import { labFromTuple } from '../../../../shared/colour/lab.js';
import type { QueuedReadingBody } from '../../core/offline/queue-item';
import { readingSummary, type SummaryNames } from './reading-summary';

const names: SummaryNames = { accession: { accessionNumber: 'HL-0917', name: 'Dusk Purple' }, character: { label: 'Petiole, middle third' }, method: 'Instrument L*a*b*' };
const base: QueuedReadingBody = { accessionId: 3, characterId: 11, method: 'instrument', lab: [38.5, 24.2, -9.6], light: 'overcast' };

describe('readingSummary', () => {
  it('should show an instrument reading as typed, its display colour from the shared conversion', () => {
    const s = readingSummary(base, names, null);
    expect(s).toEqual({ accession: 'HL-0917 Dusk Purple', character: 'Petiole, middle third', method: 'Instrument L*a*b*', lab: [38.5, 24.2, -9.6], hex: displayHex(labFromTuple([38.5, 24.2, -9.6])).hex, code: null, provisional: false });
  });

  it('should mark a photo reading provisional, with the phone preview colour', () => {
    const s = readingSummary({ ...base, method: 'photo', lab: undefined }, { ...names, method: 'Photo region' }, null, { lab: [40, 30, -10], hex: '#7b3f6e' });
    expect(s.provisional).toBe(true);
    expect(s.hex).toBe('#7b3f6e');
  });

  it('should show a chip picked by eye by its code even before the chips are loaded', () => {
    const s = readingSummary({ ...base, method: 'chip', lab: undefined, chipCode: 'F-087.014' }, { ...names, method: 'Chip by eye' }, null);
    expect(s.code).toBe('F-087.014');
    expect(s.hex).toBeNull();
  });

  it('should name the accession and character by id when the lists are not at hand', () => {
    const s = readingSummary(base, { accession: null, character: null, method: 'x' }, null);
    expect([s.accession, s.character]).toEqual(['Accession 3', 'Character 11']);
  });

  it('should name the plant, so a walk round one plant reads as that plant in the waiting list', () => {
    const s = readingSummary({ ...base, plantId: 12 }, { ...names, plant: { label: 'P3' } }, null);
    expect(s.accession).toBe('HL-0917 Dusk Purple · plant P3');
  });
});

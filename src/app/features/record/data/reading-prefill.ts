// A correction opens the form filled in from the reading it corrects.
import type { ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import type { PhotoSource, ReadingFormValue } from './reading-draft';

/** The form's value and photo for correcting a reading: everything as it was, the reason empty. */
export function prefillFrom(reading: ReadingDetail): { value: Partial<ReadingFormValue>; photo: PhotoSource | null } {
  const p = reading.provenance;
  const photo = reading.method === 'photo' && p.photoId !== null && p.region ? { photoId: p.photoId, region: p.region, neutral: p.neutralRegion } : null;
  return {
    value: {
      accessionId: reading.accessionId,
      plantId: reading.plantId,
      characterId: reading.characterId,
      siteId: reading.siteId,
      method: reading.method,
      lab: reading.method === 'instrument' ? { l: reading.lab[0], a: reading.lab[1], b: reading.lab[2] } : { l: null, a: null, b: null },
      chipCode: reading.method === 'chip' ? (p.source ?? reading.eyeChipCode ?? reading.bestChip) : null,
      hex: reading.method === 'swatch' ? (p.source ?? reading.hex) : null,
      eyeChipCode: reading.method === 'photo' || reading.method === 'instrument' ? reading.eyeChipCode : null,
      instrument: p.instrument,
      light: reading.light,
      secondsSinceCut: reading.secondsSinceCut,
      leafPosition: reading.leafPosition,
      notes: reading.notes,
      reason: null,
    },
    photo,
  };
}

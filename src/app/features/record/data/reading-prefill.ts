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
      // An adapted reading is corrected from the numbers the instrument reported, so they are not adapted twice.
      lab: reading.method === 'instrument' ? labFields(p.reportedLab ?? reading.lab) : { l: null, a: null, b: null },
      chipCode: reading.method === 'chip' ? (p.source ?? reading.eyeChipCode ?? reading.bestChip) : null,
      hex: reading.method === 'swatch' ? (p.source ?? reading.hex) : null,
      eyeChipCode: reading.method === 'photo' || reading.method === 'instrument' ? reading.eyeChipCode : null,
      instrument: p.instrument,
      illuminant: p.illuminant,
      light: reading.light,
      secondsSinceCut: reading.secondsSinceCut,
      leafPosition: reading.leafPosition,
      notes: reading.notes,
      reason: null,
    },
    photo,
  };
}

function labFields(lab: readonly [number, number, number]): { l: number; a: number; b: number } {
  return { l: lab[0], a: lab[1], b: lab[2] };
}

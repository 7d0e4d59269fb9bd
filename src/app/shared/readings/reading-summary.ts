// What the queue screen shows of a reading saved on the phone, worked out on the phone: the
// server's match replaces it when the reading arrives.
import type { ChipDto } from '../../../../shared/api/reference-set-answers.js';
import { labD50ToD65 } from '../../../../shared/colour/chromatic-adaptation.js';
import { displayHex } from '../../../../shared/colour/display-hex.js';
import { labFromTuple, type LabTuple } from '../../../../shared/colour/lab.js';
import type { QueuedReadingBody, ReadingSummary } from '../../core/offline/queue-item';
import type { ChipSet } from '../chips/chip-catalogue';

/** The names the form shows for the reading's accession, character and method. */
export interface SummaryNames {
  accession: { accessionNumber: string; name: string } | null;
  character: { label: string } | null;
  method: string;
  /** The plant read, so the waiting list tells one plant's readings from another's. */
  plant?: { label: string } | null;
}

/**
 * The card's words and colour: an instrument's CIELAB as typed (nearest chip matched here when the
 * chips are cached), a chip picked by eye as that chip, a swatch as its colour, a photo as the
 * phone's own preview, marked provisional.
 */
export function readingSummary(body: QueuedReadingBody, names: SummaryNames, chips: ChipSet | null, photoPreview: { lab: LabTuple; hex: string } | null = null): ReadingSummary {
  const base = {
    accession: `${names.accession ? `${names.accession.accessionNumber} ${names.accession.name}` : `Accession ${body.accessionId}`}${names.plant ? ` · plant ${names.plant.label}` : ''}`,
    character: names.character?.label ?? `Character ${body.characterId}`,
    method: names.method,
  };
  // Matched here for the card only, so it says "nearest"; the server's match is the one kept.
  const nearest = (lab: LabTuple) => {
    const code = chips?.match(labFromTuple(lab), 1).matches[0]?.code;
    return code ? `nearest ${code}` : null;
  };
  switch (body.method) {
    case 'instrument':
      if (!body.lab) return empty(base);
      {
        // As the server will store it: D50/2° numbers adapted to D65/2°.
        const d65 = body.illuminant === 'D50/2' ? labD50ToD65(labFromTuple(body.lab)) : labFromTuple(body.lab);
        const lab: LabTuple = [d65.l, d65.a, d65.b];
        return { ...base, lab, hex: displayHex(d65).hex, code: nearest(lab), provisional: false };
      }
    case 'chip': {
      const chip: ChipDto | undefined = body.chipCode ? chips?.chip(body.chipCode) : undefined;
      return { ...base, lab: chip?.lab ?? null, hex: chip?.hex ?? null, code: body.chipCode ?? null, provisional: false };
    }
    case 'swatch':
      return { ...base, lab: null, hex: body.hex ?? null, code: body.hex ?? null, provisional: false };
    case 'photo':
      return photoPreview ? { ...base, lab: photoPreview.lab, hex: photoPreview.hex, code: nearest(photoPreview.lab), provisional: true } : { ...empty(base), provisional: true };
  }
}

function empty(base: Pick<ReadingSummary, 'accession' | 'character' | 'method'>): ReadingSummary {
  return { ...base, lab: null, hex: null, code: null, provisional: false };
}

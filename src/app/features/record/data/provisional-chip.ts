// The nearest chip of a reading saved on the phone, worked out on the phone from the chips it
// already holds, for the "saved — waiting to send" screen. The server's match replaces it.
import type { QueuedReadingBody } from '../../../core/offline/queue-item';
import { labD50ToD65 } from '../../../../../shared/colour/chromatic-adaptation.js';
import { labFromTuple, type Lab, type LabTuple } from '../../../../../shared/colour/lab.js';
import { parseHex } from '../../../../../shared/colour/parse.js';
import type { ChipSet } from '../../../shared/chips/chip-catalogue';

/** A provisional nearest chip: code, words, display hex and ΔE00 from the reading's colour. */
export interface ProvisionalChip {
  code: string;
  name: string;
  hex: string;
  deltaE00: number;
}

/**
 * The colour the server will match, as far as the phone can tell: an instrument's L*a*b* (D50/2°
 * adapted as the server adapts it), a picked chip's own CIELAB, a swatch's hex, a photo's preview.
 */
export function provisionalLab(body: QueuedReadingBody, chips: ChipSet, photoPreview: LabTuple | null): Lab | null {
  switch (body.method) {
    case 'instrument':
      if (!body.lab) return null;
      return body.illuminant === 'D50/2' ? labD50ToD65(labFromTuple(body.lab)) : labFromTuple(body.lab);
    case 'chip': {
      const chip = body.chipCode ? chips.chip(body.chipCode) : undefined;
      return chip ? labFromTuple(chip.lab) : null;
    }
    case 'swatch':
      return body.hex ? (parseHex(body.hex) ?? null) : null;
    case 'photo':
      return photoPreview ? labFromTuple(photoPreview) : null;
  }
}

/** The nearest chip of the reading's colour in the set the phone holds; null without chips or without a colour. */
export function provisionalChip(body: QueuedReadingBody, chips: ChipSet | null, photoPreview: LabTuple | null = null): ProvisionalChip | null {
  if (!chips) return null;
  const lab = provisionalLab(body, chips, photoPreview);
  const best = lab ? chips.match(lab, 1).matches[0] : undefined;
  return best ? { code: best.code, name: best.name, hex: best.hex, deltaE00: best.deltaE00 } : null;
}

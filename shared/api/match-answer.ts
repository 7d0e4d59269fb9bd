import { displayHex } from '../colour/display-hex.js';
import { labToLch, labToTuple, type Lab } from '../colour/lab.js';
import type { Matcher } from '../colour/matcher.js';
import type { ChipDto, MatchAnswer } from './reference-set-answers.js';

/**
 * The `POST /api/match` answer for one CIELAB colour: the server sends it, and the client computes
 * the same from its own copy of the chips for instant feedback while it waits.
 */
export function matchAnswer(matcher: Matcher<ChipDto>, setId: string, lab: Lab, k: number): MatchAnswer {
  const lch = labToLch(lab);
  const shown = displayHex(lab);
  const between = matcher.between(lab);
  return {
    input: { lab: labToTuple(lab), lch: [lch.l, lch.c, lch.h], hex: shown.hex, inGamut: shown.inGamut },
    matches: matcher.nearest(lab, k).map(({ chip, deltaE, verdict }) => ({
      code: chip.code,
      parent: chip.parent,
      name: chip.name,
      hex: chip.hex,
      lab: chip.lab,
      deltaE00: deltaE,
      verdict,
    })),
    between: between ? { a: between.from.chip.code, b: between.to.chip.code, t: between.t } : null,
    setId,
  };
}

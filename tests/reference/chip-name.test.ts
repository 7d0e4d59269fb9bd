import { test } from 'node:test';
import assert from 'node:assert/strict';
import { chipName, chipNames, hueSector, pickerOrder, sectorLabel, HUE_SECTOR_ORDER } from '../../shared/colour/chip-name.js';
import { fieldChipsBySector } from '../../shared/colour/field-groups.js';
import { HUE_SECTORS, NEUTRAL_CHROMA } from '../../shared/colour/constants.js';

// Chip names of our own (reference-colors/README.md): hue sector + L* and C*ab rounded. The
// expected hue angles come from CIE 15:2004 § 8.2.1, h°ab = atan2(b*, a*), computed here with
// Math.atan2 rather than culori, which the code uses.

const hueOf = (a: number, b: number) => ((Math.atan2(b, a) * 180) / Math.PI + 360) % 360;
const at = (h: number, c = 30, l = 50) => ({ l, a: c * Math.cos((h * Math.PI) / 180), b: c * Math.sin((h * Math.PI) / 180) });

test('a name is the sector, then L* and C*ab rounded to whole numbers', () => {
  // a* 25, b* −8: h = 342.3° (plum, 322–350), C = √(625 + 64) = 26.25.
  assert.ok(Math.abs(hueOf(25, -8) - 342.25) < 0.01);
  assert.equal(chipName({ l: 30.4, a: 25, b: -8 }), 'plum L30 C26');
  // a* −25, b* 30: h = 129.8° (lime, 112–130), C = 39.05.
  assert.ok(hueOf(-25, 30) < 130);
  assert.equal(chipName({ l: 45, a: -25, b: 30 }), 'lime L45 C39');
  assert.equal(chipName({ l: 45, a: -26, b: 30 }), 'leaf L45 C40');
});

test('colours below C*ab 5 are ash, whatever their hue angle', () => {
  assert.equal(chipName({ l: 55, a: 0.5, b: 1 }), 'ash L55 C1');
  assert.equal(chipName({ l: 97.6, a: 0, b: 4.9 }), 'ash L98 C5');
  assert.equal(hueSector({ l: 50, a: 0, b: 5 }), 'straw'); // C*ab 5 is not below 5: h = 90°
});

test('each sector starts at its angle (inclusive) and the wine sector wraps through 0°', () => {
  for (const s of HUE_SECTORS) {
    assert.equal(hueSector(at(s.from + 1e-6)), s.id, `${s.id} at ${s.from}°`);
    assert.notEqual(hueSector(at(s.from - 0.01)), s.id, `just below ${s.from}°`);
  }
  assert.equal(hueSector(at(0)), 'wine');
  assert.equal(hueSector(at(359.9)), 'wine');
  assert.equal(hueSector(at(29.9)), 'wine');
  assert.equal(sectorLabel('leaf'), 'leaf h° 130–160');
  assert.equal(sectorLabel('wine'), 'wine h° 350–30');
  assert.equal(sectorLabel('ash'), `ash C* < ${NEUTRAL_CHROMA}`);
});

test('no name uses the old modifier words or hyphenated hue words, anywhere round the gamut', () => {
  const old = /very pale|greyish|moderate|strong|vivid|deep|-/;
  for (let h = 0; h < 360; h += 2) for (const l of [5, 30, 60, 95]) for (const c of [0, 3, 20, 60]) assert.doesNotMatch(chipName(at(h, c, l)), old);
});

test('a fine chip that rounds like its parent adds its hue angle; otherwise it keeps the short name', () => {
  const parent = { l: 45.2, a: -20, b: 25 };
  const close = { l: 44.9, a: -20.3, b: 24.8 };
  assert.equal(chipName(parent), chipName(close));
  assert.equal(chipName(close, parent), `${chipName(close)} h${Math.round(hueOf(-20.3, 24.8))}`);
  assert.notEqual(chipName(close, parent), chipName(parent));
  assert.equal(chipName({ l: 50, a: -20, b: 25 }, parent), chipName({ l: 50, a: -20, b: 25 }));
  const names = chipNames([
    { code: 'F-001', parent: null, lab: [45.2, -20, 25] as [number, number, number] },
    { code: 'F-001.001', parent: 'F-001', lab: [44.9, -20.3, 24.8] as [number, number, number] },
  ]);
  assert.notEqual(names[0], names[1]);
});

test('picker order: sector, then light to dark, then strongest to greyest', () => {
  const chips = [
    { code: 'a', parent: null, lab: [40, -30, 30] as [number, number, number] },
    { code: 'b', parent: null, lab: [60, -20, 20] as [number, number, number] },
    { code: 'c', parent: null, lab: [60, -30, 30] as [number, number, number] },
    { code: 'd', parent: null, lab: [80, 1, 1] as [number, number, number] },
    { code: 'e', parent: null, lab: [50, 40, 5] as [number, number, number] },
  ];
  const groups = fieldChipsBySector(chips);
  assert.deepEqual(groups.map((g) => [g.family, g.chips.map((c) => c.code)]), [['wine', ['e']], ['leaf', ['c', 'b', 'a']], ['ash', ['d']]]);
  assert.ok(pickerOrder([60, -30, 30], [60, -20, 20]) < 0);
  assert.equal(HUE_SECTOR_ORDER.at(-1), 'ash');
});

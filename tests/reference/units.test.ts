// Unit conversions of the non-colour descriptors against NIST Special Publication 811 (2008),
// "Guide for the Use of the International System of Units (SI)", Appendix B.8, where the inch,
// the foot and the avoirdupois pound are exact in SI units.
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import { formatRatio, formatSi, fromSi, KILOGRAMS_PER_POUND, METRES_PER_INCH, quantityOf, toSi, UNITS, unitsOf } from '../../shared/units/units.js';

describe('conversion factors (NIST SP 811, 2008, Appendix B.8)', () => {
  test('should define the inch as exactly 2.54 E−02 m', () => {
    assert.equal(METRES_PER_INCH, 0.0254);
    assert.equal(toSi(1, 'in'), 0.0254);
  });

  test('should define the pound (avoirdupois) as exactly 4.535 923 7 E−01 kg', () => {
    assert.equal(KILOGRAMS_PER_POUND, 0.45359237);
    assert.equal(toSi(1, 'lb'), 0.45359237);
  });

  test('should give 12 in as the foot, exactly 3.048 E−01 m (NIST SP 811 B.8)', () => {
    assert.equal(toSi(12, 'in'), 0.3048);
  });

  test('should give 36 in as the yard, exactly 9.144 E−01 m (NIST SP 811 B.8)', () => {
    assert.equal(toSi(36, 'in'), 0.9144);
  });

  test('should convert the metric prefixes by powers of ten (SI Brochure prefixes milli, centi)', () => {
    assert.equal(toSi(1016, 'mm'), 1.016);
    assert.equal(toSi(101.6, 'cm'), 1.016);
    assert.equal(toSi(850, 'g'), 0.85);
    assert.equal(toSi(2, 'kg'), 2);
    assert.equal(toSi(3, 'count'), 3);
  });

  test('should store a petiole of 40 in as 1.016 m and a sheath of 28 in as 0.7112 m (figures: common practice, no source)', () => {
    assert.equal(toSi(40, 'in'), 1.016);
    assert.equal(toSi(28, 'in'), 0.7112);
    // 28 × 0.0254 is 0.7111999999999999 in binary doubles; the stored value is the decimal one.
    assert.notEqual(28 * 0.0254, 0.7112);
  });
});

describe('round trips and quantities', () => {
  test('should read back what was typed in every unit (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...UNITS), fc.double({ min: 0.001, max: 10_000, noNaN: true }), (unit, value) => {
        const back = fromSi(toSi(value, unit), unit);
        return Math.abs(back - value) <= Math.abs(value) * 1e-10;
      }),
    );
  });

  test('should group the units by what they measure', () => {
    assert.deepEqual(unitsOf('length'), ['mm', 'cm', 'm', 'in']);
    assert.deepEqual(unitsOf('mass'), ['g', 'kg', 'lb']);
    assert.deepEqual(unitsOf('count'), ['count']);
    assert.equal(quantityOf('in'), 'length');
    assert.equal(quantityOf('lb'), 'mass');
  });

  test('should convert 1 kg to 2.20462262… lb, the inverse of the NIST pound', () => {
    assert.ok(Math.abs(fromSi(1, 'lb') - 1 / 0.45359237) < 1e-11);
    assert.equal(fromSi(1, 'lb').toFixed(8), '2.20462262');
  });
});

describe('formatting in the chosen system (precision: our own choice)', () => {
  test('should show 1.016 m as 1.02 m in metric and 40.0 in in imperial', () => {
    assert.equal(formatSi(1.016, 'length', 'metric'), '101.6 cm');
    assert.equal(formatSi(3.2, 'length', 'metric'), '3.20 m');
    assert.equal(formatSi(1.016, 'length', 'imperial'), '40.0 in');
  });

  test('should show lengths under a metre in centimetres and under a centimetre in millimetres', () => {
    assert.equal(formatSi(0.7112, 'length', 'metric'), '71.1 cm');
    assert.equal(formatSi(0.0045, 'length', 'metric'), '4.5 mm');
    assert.equal(formatSi(0.7112, 'length', 'imperial'), '28.0 in');
  });

  test('should show masses in grams under a kilogram, else kilograms; in pounds for imperial', () => {
    assert.equal(formatSi(0.85, 'mass', 'metric'), '850 g');
    assert.equal(formatSi(1.25, 'mass', 'metric'), '1.25 kg');
    assert.equal(formatSi(0.45359237, 'mass', 'imperial'), '1.00 lb');
  });

  test('should show counts without a unit and ratios to two decimals', () => {
    assert.equal(formatSi(3, 'count', 'metric'), '3');
    assert.equal(formatSi(3, 'count', 'imperial'), '3');
    assert.equal(formatRatio(0.7), '0.70');
  });
});

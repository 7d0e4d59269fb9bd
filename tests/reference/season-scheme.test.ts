// The season-scheme check shared by the server and the client's season editor: overlaps, year
// wrap, uncovered days and 29 February. Calendar facts (month lengths, 366 days in a leap year)
// are those of the Gregorian calendar; the checks below count days by hand beside each case.
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { checkSeasonScheme, dayOfYear, monthDayOf, seasonHolds, YEAR_DAYS } from '../../shared/collection/season-scheme.js';

const s = (name: string, start: string, end: string) => ({ name, start, end });

describe('month-days on the leap reference year', () => {
  test('should place 29 February as day 59 and 31 December as day 365 of a 366-day year', () => {
    assert.equal(YEAR_DAYS, 366);
    assert.equal(dayOfYear('01-01'), 0);
    assert.equal(dayOfYear('02-29'), 59);
    assert.equal(dayOfYear('03-01'), 60);
    assert.equal(dayOfYear('12-31'), 365);
  });

  test('should refuse month-days that are not real', () => {
    for (const bad of ['02-30', '04-31', '13-01', '00-10', '06-00', '6-1', '1101', '']) assert.equal(dayOfYear(bad), null, bad);
  });

  test('should turn every day number back into its month-day', () => {
    for (let d = 0; d < YEAR_DAYS; d++) assert.equal(dayOfYear(monthDayOf(d)), d);
  });

  test('should hold a day in a wrapping range across 31 December', () => {
    const wet = { start: '11-01', end: '04-30' };
    assert.ok(seasonHolds(wet, '12-31'));
    assert.ok(seasonHolds(wet, '01-01'));
    assert.ok(seasonHolds(wet, '04-30'));
    assert.ok(!seasonHolds(wet, '05-01'));
    assert.ok(!seasonHolds(wet, '10-31'));
  });
});

describe('checkSeasonScheme', () => {
  test('should accept two seasons that cover the year, one wrapping the year end, with no warnings', () => {
    const check = checkSeasonScheme([s('Wet', '11-01', '04-30'), s('Dry', '05-01', '10-31')]);
    assert.deepEqual(check, { valid: true, errors: [], warnings: [] });
  });

  test('should find the shared days of two overlapping seasons and name both', () => {
    // Dry 05-01…10-31 and Wet 10-15…04-30 share 15–31 October: 17 days.
    const check = checkSeasonScheme([s('Dry', '05-01', '10-31'), s('Wet', '10-15', '04-30')]);
    assert.equal(check.valid, false);
    const overlap = check.errors.find((e) => e.kind === 'overlap');
    assert.ok(overlap && overlap.kind === 'overlap');
    assert.deepEqual(overlap.seasons, [0, 1]);
    assert.deepEqual(overlap.runs, [{ from: '10-15', to: '10-31', days: 17 }]);
    assert.equal(overlap.field, 'seasons.1');
    assert.match(overlap.message, /“Dry” and “Wet” both cover 15 Oct–31 Oct/);
  });

  test('should keep an overlap across the year end as one run', () => {
    // Both wrap: 12-01…01-31 and 12-20…02-10 share 20 Dec – 31 Jan: 12 + 31 = 43 days.
    const check = checkSeasonScheme([s('A', '12-01', '01-31'), s('B', '12-20', '02-10')]);
    const overlap = check.errors.find((e) => e.kind === 'overlap');
    assert.ok(overlap && overlap.kind === 'overlap');
    assert.deepEqual(overlap.runs, [{ from: '12-20', to: '01-31', days: 43 }]);
  });

  test('should allow gaps but report them as a warning with the uncovered days', () => {
    // Covered: 01-01…05-31 and 07-01…11-30; uncovered: June (30 days) and December (31 days).
    const check = checkSeasonScheme([s('Early', '01-01', '05-31'), s('Late', '07-01', '11-30')]);
    assert.equal(check.valid, true);
    assert.equal(check.errors.length, 0);
    assert.equal(check.warnings.length, 1);
    const gap = check.warnings[0]!;
    assert.ok(gap.kind === 'gap');
    assert.deepEqual(gap.runs, [
      { from: '06-01', to: '06-30', days: 30 },
      { from: '12-01', to: '12-31', days: 31 },
    ]);
  });

  test('should keep a gap across the year end as one run', () => {
    // 02-01…11-30 leaves 1 Dec – 31 Jan: 31 + 31 = 62 days.
    const gap = checkSeasonScheme([s('Long', '02-01', '11-30')]).warnings[0]!;
    assert.ok(gap.kind === 'gap');
    assert.deepEqual(gap.runs, [{ from: '12-01', to: '01-31', days: 62 }]);
  });

  test('should report 29 February as uncovered when a season ends on 28 February and the next starts on 1 March', () => {
    const check = checkSeasonScheme([s('Cool', '11-01', '02-28'), s('Warm', '03-01', '10-31')]);
    assert.equal(check.valid, true);
    const gap = check.warnings[0]!;
    assert.ok(gap.kind === 'gap');
    assert.deepEqual(gap.runs, [{ from: '02-29', to: '02-29', days: 1 }]);
    assert.match(gap.message, /no season covers 29 Feb$/);
  });

  test('should accept a season that ends on 29 February, and 02-29 alone as a one-day season', () => {
    assert.deepEqual(checkSeasonScheme([s('Cool', '11-01', '02-29'), s('Warm', '03-01', '10-31')]).warnings, []);
    const leap = checkSeasonScheme([s('Leap day', '02-29', '02-29'), s('Rest', '03-01', '02-28')]);
    assert.deepEqual(leap, { valid: true, errors: [], warnings: [] });
  });

  test('should treat a season whose end is the day before its start as the whole year', () => {
    const check = checkSeasonScheme([s('All', '03-01', '02-29')]);
    assert.deepEqual(check, { valid: true, errors: [], warnings: [] });
    const both = checkSeasonScheme([s('All', '03-01', '02-29'), s('Also', '07-01', '07-01')]);
    assert.equal(both.valid, false);
  });

  test('should refuse dates that are not real month-days, naming the field', () => {
    const check = checkSeasonScheme([s('Wet', '11-01', '02-30'), s('Dry', '13-01', '10-31')]);
    assert.equal(check.valid, false);
    assert.deepEqual(check.errors.filter((e) => e.kind === 'date').map((e) => e.field), ['seasons.0.end', 'seasons.1.start']);
  });

  test('should refuse names that repeat (ignoring case and spaces) or are empty', () => {
    const check = checkSeasonScheme([s('Wet', '11-01', '04-30'), s(' wet ', '05-01', '06-30'), s('  ', '07-01', '10-31')]);
    assert.deepEqual(check.errors.map((e) => [e.kind, e.field]), [['name', 'seasons.1.name'], ['name', 'seasons.2.name']]);
  });

  test('should report a whole-year gap for an empty scheme', () => {
    const gap = checkSeasonScheme([]).warnings[0]!;
    assert.ok(gap.kind === 'gap');
    assert.deepEqual(gap.runs, [{ from: '01-01', to: '12-31', days: 366 }]);
  });
});

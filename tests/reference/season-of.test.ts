// A reading's season and season-year from its instant, the site's IANA time zone and its season
// scheme; and plant age in completed months. Time-zone offsets are those of the IANA tz database
// as shipped with Node's ICU (Pacific/Fiji UTC+12 with no daylight saving since 2022;
// America/Port_of_Spain UTC−4 all year). Season rules are our own (docs/architecture.md).
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { plantAgeMonths, parseIsoDate } from '../../shared/collection/plant-age.js';
import { localDateOf, seasonOf, seasonOfDate } from '../../shared/collection/season-of.js';

const WET_DRY = [
  { name: 'Wet', start: '11-01', end: '04-30' },
  { name: 'Dry', start: '05-01', end: '10-31' },
];
const CALENDAR = [
  { name: 'Dry', start: '01-01', end: '05-31' },
  { name: 'Wet', start: '06-01', end: '12-31' },
];
const d = (iso: string) => parseIsoDate(iso)!;

describe('season of a local date', () => {
  test('should hold the first and the last day of a season, both inclusive', () => {
    assert.deepEqual(seasonOfDate(d('2025-05-01'), WET_DRY), { season: 'Dry', seasonYear: 2025 });
    assert.deepEqual(seasonOfDate(d('2025-10-31'), WET_DRY), { season: 'Dry', seasonYear: 2025 });
    assert.deepEqual(seasonOfDate(d('2025-11-01'), WET_DRY), { season: 'Wet', seasonYear: 2025 });
    assert.deepEqual(seasonOfDate(d('2026-04-30'), WET_DRY), { season: 'Wet', seasonYear: 2025 });
    assert.deepEqual(seasonOfDate(d('2026-05-01'), WET_DRY), { season: 'Dry', seasonYear: 2026 });
  });

  test('should give a season that wraps the year end the year it started in', () => {
    // The brief's example: a wet season 1 Nov–30 Apr read on 2026-02-10 is wet 2025.
    assert.deepEqual(seasonOfDate(d('2026-02-10'), WET_DRY), { season: 'Wet', seasonYear: 2025 });
    assert.deepEqual(seasonOfDate(d('2025-12-31'), WET_DRY), { season: 'Wet', seasonYear: 2025 });
    assert.deepEqual(seasonOfDate(d('2026-01-01'), WET_DRY), { season: 'Wet', seasonYear: 2025 });
  });

  test('should keep the calendar year for a season that does not wrap', () => {
    assert.deepEqual(seasonOfDate(d('2026-01-01'), CALENDAR), { season: 'Dry', seasonYear: 2026 });
    assert.deepEqual(seasonOfDate(d('2026-12-31'), CALENDAR), { season: 'Wet', seasonYear: 2026 });
  });

  test('should give nulls for a date in no season (a gap in the scheme) and for an empty scheme', () => {
    const gappy = [
      { name: 'Long rains', start: '03-15', end: '05-31' },
      { name: 'Short rains', start: '10-15', end: '12-15' },
    ];
    assert.deepEqual(seasonOfDate(d('2026-03-14'), gappy), { season: null, seasonYear: null });
    assert.deepEqual(seasonOfDate(d('2026-03-15'), gappy), { season: 'Long rains', seasonYear: 2026 });
    assert.deepEqual(seasonOfDate(d('2026-06-01'), gappy), { season: null, seasonYear: null });
    assert.deepEqual(seasonOfDate(d('2026-12-16'), gappy), { season: null, seasonYear: null });
    assert.deepEqual(seasonOfDate(d('2026-07-01'), []), { season: null, seasonYear: null });
  });

  test('should put 29 February in the season that names or spans it', () => {
    assert.deepEqual(seasonOfDate(d('2028-02-29'), WET_DRY), { season: 'Wet', seasonYear: 2027 });
    const leapy = [
      { name: 'Late', start: '02-29', end: '03-31' },
      { name: 'Rest', start: '04-01', end: '02-28' },
    ];
    assert.deepEqual(seasonOfDate(d('2028-02-29'), leapy), { season: 'Late', seasonYear: 2028 });
    // In a common year a season starting on 02-29 begins, in effect, on 1 March.
    assert.deepEqual(seasonOfDate(d('2027-02-28'), leapy), { season: 'Rest', seasonYear: 2026 });
    assert.deepEqual(seasonOfDate(d('2027-03-01'), leapy), { season: 'Late', seasonYear: 2027 });
  });

  test('should count 29 February with 28 February when a scheme typed without leap days leaves it out', () => {
    const noLeap = [
      { name: 'Early', start: '01-01', end: '02-28' },
      { name: 'Later', start: '03-01', end: '12-31' },
    ];
    assert.deepEqual(seasonOfDate(d('2028-02-29'), noLeap), { season: 'Early', seasonYear: 2028 });
    // A wrapping season ending 02-28: its leap day still belongs to the season begun the year before.
    const wrapNoLeap = [
      { name: 'Cool', start: '11-01', end: '02-28' },
      { name: 'Warm', start: '03-01', end: '10-31' },
    ];
    assert.deepEqual(seasonOfDate(d('2028-02-29'), wrapNoLeap), { season: 'Cool', seasonYear: 2027 });
  });
});

describe('season of an instant at a site', () => {
  // 2026-05-31T23:30Z is already 1 June in Fiji (UTC+12) and still 31 May in Port of Spain (UTC−4).
  const instant = new Date('2026-05-31T23:30:00Z');

  test('should read the local date in the site’s zone', () => {
    assert.deepEqual(localDateOf(instant, 'Pacific/Fiji'), { year: 2026, month: 6, day: 1 });
    assert.deepEqual(localDateOf(instant, 'America/Port_of_Spain'), { year: 2026, month: 5, day: 31 });
    assert.deepEqual(localDateOf(instant, 'UTC'), { year: 2026, month: 5, day: 31 });
  });

  test('should give the next day’s season in Fiji and the same day’s in Port of Spain', () => {
    assert.deepEqual(seasonOf(instant, 'America/Port_of_Spain', CALENDAR), { season: 'Dry', seasonYear: 2026 });
    assert.deepEqual(seasonOf(instant, 'Pacific/Fiji', CALENDAR), { season: 'Wet', seasonYear: 2026 });
  });

  test('should cross the year end by the local clock', () => {
    // 2025-12-31T23:30Z is 1 January 2026 in Fiji, 31 December 2025 in Port of Spain.
    const newYear = new Date('2025-12-31T23:30:00Z');
    assert.deepEqual(seasonOf(newYear, 'Pacific/Fiji', CALENDAR), { season: 'Dry', seasonYear: 2026 });
    assert.deepEqual(seasonOf(newYear, 'America/Port_of_Spain', CALENDAR), { season: 'Wet', seasonYear: 2025 });
    // The Fiji wet season keeps its start year on both sides of midnight.
    assert.deepEqual(seasonOf(new Date('2025-12-31T11:59:00Z'), 'Pacific/Fiji', WET_DRY), { season: 'Wet', seasonYear: 2025 });
    assert.deepEqual(seasonOf(new Date('2025-12-31T12:00:00Z'), 'Pacific/Fiji', WET_DRY), { season: 'Wet', seasonYear: 2025 });
  });

  test('should refuse a zone the runtime does not know', () => {
    assert.throws(() => seasonOf(instant, 'Mars/Olympus_Mons', WET_DRY), RangeError);
  });
});

describe('plant age in completed months', () => {
  test('should count a month complete when the planting day comes round again', () => {
    assert.equal(plantAgeMonths('2025-01-20', d('2025-01-20')), 0);
    assert.equal(plantAgeMonths('2025-01-20', d('2025-02-19')), 0);
    assert.equal(plantAgeMonths('2025-01-20', d('2025-02-20')), 1);
    assert.equal(plantAgeMonths('2025-01-20', d('2026-02-10')), 12);
    assert.equal(plantAgeMonths('2025-01-20', d('2026-01-20')), 12);
  });

  test('should not complete a month too short to hold the planting day', () => {
    assert.equal(plantAgeMonths('2025-01-31', d('2025-02-28')), 0);
    assert.equal(plantAgeMonths('2025-01-31', d('2025-03-30')), 1);
    assert.equal(plantAgeMonths('2025-01-31', d('2025-03-31')), 2);
    assert.equal(plantAgeMonths('2024-02-29', d('2025-02-28')), 11);
    assert.equal(plantAgeMonths('2024-02-29', d('2025-03-01')), 12);
  });

  test('should be null before planting or for a date that is not one', () => {
    assert.equal(plantAgeMonths('2026-03-01', d('2026-02-28')), null);
    assert.equal(plantAgeMonths('2026-02-30', d('2026-03-10')), null);
    assert.equal(plantAgeMonths('soon', d('2026-03-10')), null);
  });

  test('should count on the site’s local date', () => {
    // 23:30 UTC on 19 Feb is 20 Feb in Fiji: the first month is complete there, not in Port of Spain.
    const instant = new Date('2025-02-19T23:30:00Z');
    assert.equal(plantAgeMonths('2025-01-20', localDateOf(instant, 'Pacific/Fiji')), 1);
    assert.equal(plantAgeMonths('2025-01-20', localDateOf(instant, 'America/Port_of_Spain')), 0);
  });
});

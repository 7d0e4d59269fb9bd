import { schemeProblems } from './season-problems';

describe('season scheme problems', () => {
  it('should find nothing wrong with wet across the year end and dry', () => {
    expect(schemeProblems([
      { name: 'Wet', start: '11-01', end: '04-30' },
      { name: 'Dry', start: '05-01', end: '10-31' },
    ])).toEqual([]);
  });

  it('should name both seasons and the shared days of an overlap, and block the save', () => {
    const [problem, ...rest] = schemeProblems([
      { name: 'Wet', start: '11-01', end: '04-30' },
      { name: 'Dry', start: '04-15', end: '10-31' },
    ]);
    expect(rest).toEqual([]);
    expect(problem.kind).toBe('overlap');
    expect(problem.blocking).toBe(true);
    expect(problem.text).toContain('“Wet” and “Dry” both cover 15 Apr–30 Apr');
  });

  it('should keep an overlap across the year end as one stretch', () => {
    const problems = schemeProblems([
      { name: 'Cool', start: '12-01', end: '01-31' },
      { name: 'Rest', start: '12-20', end: '11-30' },
    ]);
    expect(problems.filter((p) => p.kind === 'overlap').map((p) => p.text)).toEqual([
      '“Cool” and “Rest” both cover 20 Dec–31 Jan — a day may belong to one season only.',
    ]);
  });

  it('should warn, without blocking, which days no season covers across the year end', () => {
    expect(schemeProblems([{ name: 'Long', start: '01-11', end: '11-30' }])).toEqual([
      { kind: 'gap', text: 'No season covers 1 Dec–10 Jan; readings on those days get no season.', blocking: false },
    ]);
  });

  it('should point out a scheme that forgets 29 February', () => {
    const problems = schemeProblems([
      { name: 'Early', start: '03-01', end: '08-31' },
      { name: 'Late', start: '09-01', end: '02-28' },
    ]);
    expect(problems.map((p) => p.text)).toEqual(['No season covers 29 Feb; readings on those days get no season.']);
  });

  it('should refuse two seasons with one name, whatever the case', () => {
    const problems = schemeProblems([
      { name: 'Dry', start: '01-01', end: '06-30' },
      { name: 'dry ', start: '07-01', end: '12-31' },
    ]);
    expect(problems).toEqual([{ kind: 'name', text: 'Season 2 repeats the name of season 1.', blocking: true }]);
  });

  it('should leave half-typed dates and empty names to the fields', () => {
    const problems = schemeProblems([
      { name: '', start: '11-0', end: '04-30' },
      { name: 'Dry', start: '05-01', end: '10-31' },
    ]);
    expect(problems.map((p) => p.kind)).toEqual(['gap']);
  });
});

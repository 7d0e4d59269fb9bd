import { DEFAULT_PAGE_SIZE, activeFilterCount, filtersFromParams, paramsFromFilters } from './reading-filters';

describe('reading filters in the URL', () => {
  it('should read every filter from the query parameters', () => {
    const query = filtersFromParams({
      accessionId: '3',
      characterId: '12',
      siteId: '2',
      observerId: '4',
      season: 'Wet',
      seasonYear: '2025',
      method: 'chip',
      status: 'flagged',
      from: '2026-01-01',
      to: '2026-03-31',
      includeSuperseded: 'true',
      sort: 'deltaE00',
      dir: 'asc',
      page: '3',
      pageSize: '50',
    });
    expect(query).toEqual({
      accessionId: 3,
      characterId: 12,
      siteId: 2,
      observerId: 4,
      season: 'Wet',
      seasonYear: 2025,
      method: 'chip',
      status: 'flagged',
      from: '2026-01-01',
      to: '2026-03-31',
      includeSuperseded: true,
      sort: 'deltaE00',
      dir: 'asc',
      page: 3,
      pageSize: 50,
    });
    expect(activeFilterCount(query)).toBe(11);
  });

  it('should drop malformed values and fill in the defaults', () => {
    expect(
      filtersFromParams({ accessionId: '-1', siteId: '2x', method: 'guess', status: 'done', from: '1 March', sort: 'colour', dir: 'up', page: '0', pageSize: '7', includeSuperseded: 'yes' }),
    ).toEqual({ sort: 'observedAt', dir: 'desc', page: 1, pageSize: DEFAULT_PAGE_SIZE });
  });

  it('should drop an end date before the start date, which the server refuses', () => {
    expect(filtersFromParams({ from: '2026-03-01', to: '2026-02-01' })).toMatchObject({ from: '2026-03-01' });
    expect(filtersFromParams({ from: '2026-03-01', to: '2026-02-01' }).to).toBeUndefined();
  });

  it('should write back what it read, leaving defaults out of the address', () => {
    const params = { accessionId: '3', method: 'photo', sort: 'deltaE00', dir: 'asc', page: '2' };
    const written = paramsFromFilters(filtersFromParams(params));
    const kept = Object.fromEntries(Object.entries(written).filter(([, v]) => v !== null).map(([k, v]) => [k, String(v)]));
    expect(kept).toEqual(params);
  });

  it('should clear every unset filter with null so the router removes it', () => {
    const written = paramsFromFilters(filtersFromParams({}));
    expect(Object.values(written).every((v) => v === null)).toBe(true);
    expect(Object.keys(written)).toContain('includeSuperseded');
  });
});

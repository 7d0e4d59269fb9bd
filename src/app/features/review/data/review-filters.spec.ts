import { paramsFromQueue, queueFromParams } from './review-filters';

describe('review queue filters in the URL', () => {
  it('should read the filters, oldest first, and drop malformed ones', () => {
    expect(queueFromParams({ accessionId: '4', observerId: 'nine', status: 'flagged', from: '2025-02-01', to: '2025-01-01', pageSize: '7' })).toEqual({
      sort: 'observedAt',
      dir: 'asc',
      accessionId: 4,
      status: 'flagged',
      from: '2025-02-01',
      page: 1,
      pageSize: 25,
    });
  });

  it('should leave the default status and page out of the URL', () => {
    const params = paramsFromQueue({ status: 'submitted', page: 1, pageSize: 25, siteId: 2 });
    expect(params['status']).toBeNull();
    expect(params['page']).toBeNull();
    expect(params['siteId']).toBe(2);
  });

  it('should read back what it writes', () => {
    const query = queueFromParams({ characterId: '3', status: 'reread-requested', from: '2025-01-01', to: '2025-03-31', page: '2', pageSize: '10' });
    const written = paramsFromQueue(query);
    const strings = Object.fromEntries(Object.entries(written).filter(([, v]) => v !== null).map(([k, v]) => [k, String(v)]));
    expect(queueFromParams(strings)).toEqual(query);
  });
});

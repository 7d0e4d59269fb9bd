import { describeAuditDetail } from './audit-page';

describe('describeAuditDetail', () => {
  it('should show a dash when an event has no detail', () => {
    expect(describeAuditDetail(null)).toBe('—');
  });

  it('should list key and value pairs', () => {
    expect(describeAuditDetail({ email: 'a@demo.test', role: 'recorder' })).toBe('email: a@demo.test; role: recorder');
  });

  it('should shorten a long list to its first items and a count', () => {
    expect(describeAuditDetail({ added: ['a', 'b', 'c', 'd', 'e', 'f'] })).toBe('added: a, b, c, d and 2 more');
  });

  it('should write numbers and flags as they are', () => {
    expect(describeAuditDetail({ sites: 4, active: false })).toBe('sites: 4; active: false');
  });
});

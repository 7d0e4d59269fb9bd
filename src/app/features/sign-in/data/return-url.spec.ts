import { safeReturnUrl } from './return-url';

describe('safeReturnUrl', () => {
  it('should keep an in-app path with its query', () => {
    expect(safeReturnUrl('/admin/users?page=2')).toBe('/admin/users?page=2');
  });

  it('should send home when there is no return address', () => {
    expect(safeReturnUrl(undefined)).toBe('/');
  });

  it('should refuse an address on another site', () => {
    expect(safeReturnUrl('https://elsewhere.example/x')).toBe('/');
  });

  it('should refuse a protocol-relative address', () => {
    expect(safeReturnUrl('//elsewhere.example/x')).toBe('/');
  });

  it('should not return to the sign-in page itself', () => {
    expect(safeReturnUrl('/sign-in?returnUrl=%2Fx')).toBe('/');
  });
});

import { linkify } from './linkify';

describe('linkify', () => {
  it('should split text around an http link', () => {
    expect(linkify('Open http://localhost:3000/invitation/abc to join')).toEqual([
      { kind: 'text', text: 'Open ' },
      { kind: 'link', text: 'http://localhost:3000/invitation/abc', href: 'http://localhost:3000/invitation/abc' },
      { kind: 'text', text: ' to join' },
    ]);
  });

  it('should leave a full stop after a link out of the link', () => {
    const parts = linkify('Go to https://example.test/reset-password/xyz.');
    expect(parts[1]).toEqual({ kind: 'link', text: 'https://example.test/reset-password/xyz', href: 'https://example.test/reset-password/xyz' });
    expect(parts[2]).toEqual({ kind: 'text', text: '.' });
  });

  it('should keep a javascript: address as plain text', () => {
    expect(linkify('click javascript:alert(1)')).toEqual([{ kind: 'text', text: 'click javascript:alert(1)' }]);
  });

  it('should keep markup as plain text rather than parse it', () => {
    const parts = linkify('<b>hi</b> http://a.test/x');
    expect(parts[0]).toEqual({ kind: 'text', text: '<b>hi</b> ' });
    expect(parts[1].kind).toBe('link');
  });

  it('should return no parts for empty text', () => {
    expect(linkify('')).toEqual([]);
  });
});

import { decisionForKey } from './review-keys';

describe('review shortcuts', () => {
  it('should read A, F and R in either case as the three decisions', () => {
    expect(decisionForKey({ key: 'a' })).toBe('approve');
    expect(decisionForKey({ key: 'F' })).toBe('flag');
    expect(decisionForKey({ key: 'r' })).toBe('reread');
  });

  it('should ignore other keys and keys with a modifier (Ctrl+R reloads the page)', () => {
    expect(decisionForKey({ key: 'x' })).toBeNull();
    expect(decisionForKey({ key: 'Enter' })).toBeNull();
    expect(decisionForKey({ key: 'r', ctrlKey: true })).toBeNull();
    expect(decisionForKey({ key: 'a', metaKey: true })).toBeNull();
  });

  it('should ignore letters typed into the comment', () => {
    const textarea = document.createElement('textarea');
    const input = document.createElement('input');
    const button = document.createElement('button');
    expect(decisionForKey({ key: 'a', target: textarea })).toBeNull();
    expect(decisionForKey({ key: 'f', target: input })).toBeNull();
    expect(decisionForKey({ key: 'f', target: button })).toBe('flag');
  });
});

import { lastTryWords, savedAt, waitingWords } from './queue-words';

describe('queue words', () => {
  it('should count readings in words, singular and plural', () => {
    expect(waitingWords(1)).toBe('1 reading waiting to send');
    expect(waitingWords(3)).toBe('3 readings waiting to send');
  });

  it('should say how often a waiting reading was tried and what happened last', () => {
    const lastError = { status: 0, title: 'No connection', detail: null, fieldErrors: [] };
    expect(lastTryWords({ attempts: 0, lastError: null, state: 'waiting' })).toBeNull();
    expect(lastTryWords({ attempts: 1, lastError, state: 'waiting' })).toBe('Tried once; last time: No connection');
    expect(lastTryWords({ attempts: 4, lastError, state: 'waiting' })).toBe('Tried 4 times; last time: No connection');
    expect(lastTryWords({ attempts: 2, lastError, state: 'needs-attention' })).toBeNull();
  });

  it('should give the time saved with day and month', () => {
    expect(savedAt('2026-03-01T09:05:00Z', 'en-GB')).toMatch(/1 Mar 2026/);
    // The same style as every other date: en-GB's 24-hour clock, en-US's 12-hour one.
    expect(savedAt('2026-03-01T15:05:00Z', 'en-GB')).not.toMatch(/AM|PM/);
    expect(savedAt('2026-03-01T15:05:00Z', 'en-US')).toMatch(/Mar 1, 2026.*\d:05\s?(AM|PM)/);
  });
});

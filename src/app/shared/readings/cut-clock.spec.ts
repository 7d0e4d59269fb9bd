import { cutWarning, elapsedSeconds, limitWords, stopwatchText } from './cut-clock';

describe('cut clock', () => {
  it('should count whole seconds and never below zero', () => {
    expect(elapsedSeconds(1_000, 62_999)).toBe(61);
    expect(elapsedSeconds(5_000, 1_000)).toBe(0);
  });

  it('should warn only past the limit', () => {
    expect(cutWarning(60, 60)).toBeNull();
    expect(cutWarning(61, 60)).toContain('More than a minute since the cut');
    expect(cutWarning(null, 60)).toBeNull();
  });

  it('should say the limit in words', () => {
    expect(limitWords(60)).toBe('a minute');
    expect(limitWords(120)).toBe('2 minutes');
    expect(limitWords(90)).toBe('90 seconds');
  });

  it('should show minutes and seconds as a stopwatch does', () => {
    expect(stopwatchText(7)).toBe('0:07');
    expect(stopwatchText(92)).toBe('1:32');
  });
});

import { biasNumbers, biasWords, shiftWords } from './bias-words';

describe('bias in words', () => {
  it('should read a lighter and bluer observer as such, the larger shift first', () => {
    expect(biasWords([2.4, 0.3, -4.1])).toBe('reads bluer and slightly lighter than the reference');
  });

  it('should name every axis by its sign: lighter/darker, redder/greener, yellower/bluer', () => {
    expect(shiftWords(0, 3)).toBe('lighter');
    expect(shiftWords(0, -3)).toBe('darker');
    expect(shiftWords(1, 3.5)).toBe('redder');
    expect(shiftWords(1, -3.5)).toBe('greener');
    expect(shiftWords(2, 4)).toBe('yellower');
    expect(shiftWords(2, -4)).toBe('bluer');
  });

  it('should grade the size: slightly below 3, plain from 3, much from 6', () => {
    expect(shiftWords(0, 1)).toBe('slightly lighter');
    expect(shiftWords(0, 2.99)).toBe('slightly lighter');
    expect(shiftWords(0, 5.99)).toBe('lighter');
    expect(shiftWords(0, -6)).toBe('much darker');
  });

  it('should leave out shifts under one unit and say when there is no clear bias', () => {
    expect(shiftWords(1, 0.99)).toBeNull();
    expect(biasWords([0.5, -0.9, 0.2])).toBe('no clear bias: every shift is under 1 CIELAB unit');
  });

  it('should join three shifts with commas and "and"', () => {
    expect(biasWords([-7, 3, 1.5])).toBe('reads much darker, redder and slightly yellower than the reference');
  });

  it('should say so when there are no answers', () => {
    expect(biasWords(null)).toBe('no answers yet');
  });

  it('should print the same bias as signed numbers with true minus signs', () => {
    expect(biasNumbers([2.4, 0, -4.125])).toBe('ΔL* +2.40, Δa* 0.00, Δb* −4.13');
  });
});

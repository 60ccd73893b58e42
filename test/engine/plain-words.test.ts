import { describe, it, expect } from 'vitest';
import { plainWords } from '../../engine/runtime/plain-words.js';
import { quoteInUserUnits } from '../../engine/runtime/quote.js';
import { math } from '../../cells/math.js';

describe('plainWords: mathjs messages in the words of a calc', () => {
  it('plainWords(a signature error on a missing value) names neither the internal function nor a JavaScript type', () => {
    const said = plainWords('Unexpected type of argument in function multiplyScalar (expected: number or Complex or BigNumber or Fraction, actual: identifier | undefined, index: 0)');
    expect(said).toBe('cannot use a missing value in "*"; it takes a plain number');
  });

  it('plainWords(too many arguments) counts them', () => {
    expect(plainWords('Too many arguments in function sqrt (expected: 1, actual: 2)')).toBe('sqrt(…) takes 1 argument, got 2');
  });
});

describe('quoteInUserUnits: kernel numbers in the document\'s units', () => {
  it('quoteInUserUnits(SI quantity given by the document) quotes it as written', () => {
    const given = [{ si: 'N', number: -10000, value: math.unit(-10, 'kN') }];
    expect(quoteInUserUnits('buttress: T must be positive, got -10000 N', given, 4)).toBe('buttress: T must be positive, got −10 kN');
  });

  it('quoteInUserUnits(SI quantity not given) uses the display unit of its dimension; long numbers are rounded', () => {
    expect(quoteInUserUnits('unit_weight must be positive, got -18000 N/m^3', [], 4)).toBe('unit_weight must be positive, got −18 kN/m^3');
    expect(quoteInUserUnits('rise/span = 0.33333333333333 is more than', [], 3)).toBe('rise/span = 0.333 is more than');
  });

  it('quoteInUserUnits(a call written in ft and kip) quotes a quantity not given in kip', () => {
    // 17.8 kN / 4.4482216152605 kN per kip = 4.0016 kip (NIST SP 811, Appendix B: 1 lbf = 4.4482216152605 N).
    const given = [{ si: 'm', number: 6.096, value: math.unit(20, 'ft') }];
    expect(quoteInUserUnits('H = 17800 N is more than the wall takes', given, 4)).toBe('H = 4.002 kip is more than the wall takes');
  });

  it('quoteInUserUnits leaves clause numbers and N/mm² alone', () => {
    const text = 'f_b = 80 N/mm² is above 75 N/mm², the limit of EN 1996-1-1 3.6.1.2 (from memory)';
    expect(quoteInUserUnits(text, [], 3)).toBe(text);
  });
});

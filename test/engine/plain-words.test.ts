import { describe, it, expect } from 'vitest';
import { plainWords } from '../../engine/runtime/plain-words.js';
import { quoteInUserUnits } from '../../engine/runtime/quote.js';
import { math } from '../../cells/math.js';
import { evaluateDocument } from '../../engine/index.js';
import { fence } from '../helpers/settle.js';

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

  it('a refusal of a call without quantities of its own (dome_limit(d)) in a calc written in ft and psf quotes psf, not kN/m^2', async () => {
    // dome_limit refuses a weightless dome (g = 0); the call passes only the dome's record, so the document's units decide.
    const text = fence('given', 'R = 20 ft', 'p_l = 30 psf') + '\n' + fence('calc', 'd = dome({radius: R, half_angle: 90 deg, thickness: 1 ft, g: 0 psf, p: p_l})', 'l = dome_limit(d)');
    const { summary } = await evaluateDocument(text, { file: 'g0.md' });
    const d = summary.diagnostics.find((x) => x.cell === 'l')!;
    expect(d.message).toBe('dome_limit: the dome needs its self-weight (unit_weight, or g above zero), got g = 0 psf');
  });

  it('quoteInUserUnits leaves clause numbers and N/mm² alone', () => {
    const text = 'f_b = 80 N/mm² is above 75 N/mm², the limit of EN 1996-1-1 3.6.1.2 (from memory)';
    expect(quoteInUserUnits(text, [], 3)).toBe(text);
  });
});

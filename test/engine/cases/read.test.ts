/**
 * readCaseBook and expandCases: the ```cases format and every error on its line.
 * The engineering in these documents is a simply supported beam under one point load
 * (M = P·a·b/L, R = P·b/L: any statics text, e.g. Gere & Timoshenko, Mechanics of Materials, App. G).
 */
import { describe, it, expect } from 'vitest';
import { compile, evaluateDocument } from '../../../engine/index.js';
import { fence } from '../../helpers/settle.js';

const BEAM = [
  fence('given', 'L = 6 m  # span', 'gamma_G = 1.0  # factor on the load', 'P = 10 kN  # point load', 'x_P = 3 m  # where the load stands'),
  fence('calc', 'M = gamma_G * P * x_P * (L - x_P) / L to kN m', 'R = gamma_G * P * (L - x_P) / L to kN'),
  fence('check', 'c_M = M <= 20 kN m  # bending', 'c_R = R <= 9 kN  # left reaction [in STR, axle]'),
].join('\n');

/** The document with a cases cell of these lines; the cell's first line is line 19 of the file. */
function withCases(...lines: string[]): string {
  return `${BEAM}\n${fence('cases', ...lines)}`;
}

function problems(text: string): string[] {
  return compile(text, { file: 'beam.md' }).diagnostics.map((d) => `${d.line}:${d.column} ${d.ruleId} ${d.message}`);
}

async function evaluated(text: string) {
  return (await evaluateDocument(text, { file: 'beam.md' })).summary;
}

describe('readCaseBook (errors found when the document compiles)', () => {
  it('readCaseBook accepts the format of the issue: single cases and a family, with descriptions', () => {
    const doc = compile(withCases('EQU = {gamma_G: 1.1}  # overturning', 'STR = {gamma_G: 1.35}', 'axle = {x_P: steps(0.1 * L, 0.9 * L, 5)}  # the axle rolled'), { file: 'beam.md' });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.cases.lines.map((l) => [l.name, l.description, l.span.start.line, l.values.map((v) => v.input)])).toEqual([
      ['EQU', 'overturning', 19, ['gamma_G']], ['STR', '', 20, ['gamma_G']], ['axle', 'the axle rolled', 21, ['x_P']],
    ]);
  });

  it('a key that is not a given input is an error on its line and column, with "did you mean"', () => {
    expect(problems(withCases('EQU = {gama_G: 1.1}'))).toEqual(['19:8 cases/unknown-input EQU: "gama_G" is not a given input of this document; did you mean "gamma_G"?', '15:34 cases/unknown-case the check is limited to "STR", which is no case or family (cases: EQU)',
      '15:34 cases/unknown-case the check is limited to "axle", which is no case or family (cases: EQU)']);
  });

  it('a key naming a calc cell is refused: only given inputs can change', () => {
    expect(problems(withCases('STR = {M: 3 kN m}', 'axle = {x_P: 1 m}'))[0]).toBe('19:8 cases/unknown-input STR: "M" is a calc cell, not a given input; did you mean "L"?');
  });

  it('duplicate case names and a case named like a cell are errors on the second line', () => {
    expect(problems(withCases('STR = {gamma_G: 1.35}', 'STR = {gamma_G: 1.2}', 'M = {x_P: 2 m}', 'axle = {x_P: 1 m}'))).toEqual([
      '20:1 cases/duplicate the case "STR" is already defined on line 19',
      '21:1 cases/duplicate "M" is already the name of a cell on line 9; give the case another name',
    ]);
  });

  it('an input given twice in one case is an error at its second mention (mathjs would keep the last silently)', () => {
    expect(problems(withCases('STR = {x_P: 1 m, x_P: 2 m}', 'axle = {x_P: 1 m}'))).toEqual(['19:18 cases/duplicate STR: the input "x_P" is given twice in this case; give each input once']);
    expect(problems(withCases('STR = {x_P: 1 m,', '  "x_P": 2 m}', 'axle = {x_P: 1 m}'))).toEqual(['20:3 cases/duplicate STR: the input "x_P" is given twice in this case; give each input once']);
    // The same input in two different cases, or inside a nested value, is no repetition.
    expect(problems(withCases('STR = {x_P: 1 m, gamma_G: 1.35}', 'axle = {x_P: steps(1 m, 2 m, 3)}'))).toEqual([]);
  });

  it('a record left open is an error of its line alone: the lines after it are still read and their errors reported', () => {
    expect(problems(withCases('STR = {x_P: 2 m', 'axle = {gama_G: 1}', 'C = {x_P: 1 m'))).toEqual([
      '19:1 cases/syntax STR: a bracket opened here is not closed before the next case line or the end of the cell; end the record with }, e.g. STR = {gamma_G: 1.1}',
      '20:9 cases/unknown-input axle: "gama_G" is not a given input of this document; did you mean "gamma_G"?',
      '21:1 cases/syntax C: a bracket opened here is not closed before the next case line or the end of the cell; end the record with }, e.g. C = {gamma_G: 1.1}',
    ]);
    // A record may still run over several lines.
    const doc = compile(withCases('STR = {x_P: 2 m,', '       gamma_G: 1.35}  # over two lines', 'axle = {x_P: 1 m}'), { file: 'beam.md' });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.cases.lines.map((l) => [l.name, l.span.start.line, l.values.map((v) => v.input)])).toEqual([['STR', 19, ['x_P', 'gamma_G']], ['axle', 21, ['x_P']]]);
  });

  it('a line that is not NAME = {…} is an error that shows the format', () => {
    expect(problems(withCases('STR = 1.35', 'axle = {x_P: 1 m}'))).toEqual(['19:1 cases/syntax STR: a case is a record of inputs, e.g. STR = {gamma_G: 1.1}']);
  });

  it('a case value goes through the same sandbox refusals as a cell', () => {
    expect(problems(withCases('STR = {x_P: evaluate("3 m")}', 'axle = {x_P: 1 m}'))).toEqual(['19:8 sandbox/refused STR: x_P: "evaluate" is not available in a calc document']);
    expect(problems(withCases('STR = {x_P: import({}) }', 'axle = {x_P: 1 m}'))[0]).toContain('sandbox/refused');
  });

  it('an unknown name in a case value is an error with "did you mean"', () => {
    expect(problems(withCases('STR = {x_P: 0.5 * Ll}', 'axle = {x_P: 1 m}'))).toEqual(['19:8 graph/unknown-name STR: x_P: unknown name "Ll"; did you mean "L"?']);
  });

  it('a limit marker written any other way than [in NAME, …] at the end of the comment is an error at the marker, saying what to write', () => {
    const doc = (marker: string) => [BEAM.replace('[in STR, axle]', marker), fence('cases', 'STR = {gamma_G: 1.35}', 'axle = {x_P: 1 m}')].join('\n');
    const hint = ' at the very end of the check\'s comment (lower-case "in", a space, then cases or families separated by commas; one member of a family as axle[2])';
    expect(problems(doc('[in: STR]'))).toEqual([`15:34 cases/syntax cannot read the limit marker "[in: STR]": it is not read as a limit; write [in STR]${hint}`]);
    expect(problems(doc('[In STR]'))).toEqual([`15:34 cases/syntax cannot read the limit marker "[In STR]": it is not read as a limit; write [in STR]${hint}`]);
    expect(problems(doc('[in STR] when wet'))).toEqual([`15:34 cases/syntax cannot read the limit marker "[in STR]": the marker must end the comment (here "when wet" follows it); write [in STR]${hint}`]);
    expect(problems(doc('[ in STR, axle ]'))).toEqual([`15:34 cases/syntax cannot read the limit marker "[ in STR, axle ]": it is not read as a limit; write [in STR, axle]${hint}`]);
    // Words that merely start with "in" are no marker.
    expect(problems(doc('[index 3]'))).toEqual([]);
  });

  it('[in axle[2]] limits a check to one member of a family; a member that does not exist is an error at the marker', async () => {
    const text = (marker: string) => [BEAM.replace('[in STR, axle]', marker), fence('cases', 'STR = {gamma_G: 1.35}', 'axle = {x_P: steps(1 m, 5 m, 3)}')].join('\n');
    expect(problems(text('[in axle[2]]'))).toEqual([]);
    const ok = await evaluateDocument(text('[in axle[2]]'), { file: 'beam.md' });
    expect(ok.cases.checks.get('c_R')!.cases.map((x) => x.case)).toEqual(['axle[2]']);
    const bad = await evaluateDocument(text('[in STR, axle[4]]'), { file: 'beam.md' });
    expect(bad.summary.diagnostics.map((d) => `${d.line}:${d.column} ${d.ruleId} ${d.message}`)).toEqual(['15:43 cases/unknown-case the check is limited to "axle[4]", but axle has 3 cases (axle[1…3])']);
    expect(problems(text('[in axle[0]]'))).toEqual(['15:34 cases/unknown-case the check is limited to "axle[0]": members of a family count from 1 (axle[1])']);
  });

  it('a check limited to a case that does not exist is an error on the check, with "did you mean"', () => {
    expect(problems(withCases('STR = {gamma_G: 1.35}', 'axl = {x_P: 1 m}'))).toEqual(['15:34 cases/unknown-case the check is limited to "axle", which is no case or family; did you mean "axl"?']);
  });
});

describe('expandCases (errors found against the document as written)', () => {
  it('a value of the wrong dimension is an error naming both dimensions', async () => {
    const s = await evaluated(withCases('STR = {gamma_G: 1.35 m}', 'axle = {x_P: 10 kN}'));
    expect(s.diagnostics.map((d) => `${d.line}:${d.column} ${d.ruleId} ${d.message}`)).toEqual([
      '19:8 cases/dimension STR: gamma_G: the document\'s value is a plain number (1); this gives a quantity in m (1.35 m)',
      '20:9 cases/dimension axle: x_P: the value 10 kN does not have the dimension of the document\'s 3 m',
    ]);
  });

  it('a case value outside its input\'s [lo, hi] range is a warning on the case line (once, a family with its count), not an error', async () => {
    const ranged = withCases('STR = {x_P: 9 m}  # beyond the span', 'axle = {x_P: steps(0 m, 8 m, 5)}').replace('x_P = 3 m  # where the load stands', 'x_P = 3 m  # where the load stands [0 m, 4 m]');
    const s = await evaluated(ranged);
    expect(s.diagnostics.map((d) => `${d.line}:${d.column} ${d.severity} ${d.ruleId} ${d.message}`)).toEqual([
      '19:8 warning value/range STR: x_P = 9 m is outside the allowed range [0 m, 4 m]',
      // steps(0 m, 8 m, 5): 0, 2, 4, 6, 8 m; 6 m and 8 m lie outside.
      '20:9 warning value/range axle: x_P = 6 m is outside the allowed range [0 m, 4 m] (and 1 more of the 5 values)',
    ]);
    // --set x_P pins the input in every case: the case values are not used, so no warning.
    const pinned = await evaluateDocument(ranged, { file: 'beam.md', overrides: { x_P: '2 m' } });
    expect(pinned.summary.diagnostics).toEqual([]);
  });

  it('an empty family is an error on its line', async () => {
    const s = await evaluated(withCases('STR = {gamma_G: 1.35}', 'axle = {x_P: steps(1 m, 2 m, 0)}'));
    expect(s.diagnostics.map((d) => `${d.line} ${d.ruleId} ${d.message}`)).toEqual(['20 cases/empty-family axle: the list for x_P is empty, so the family has no case']);
  });

  it('more cases than the limit is an error that says how many were asked for', async () => {
    const s = await evaluated(withCases('STR = {gamma_G: 1.35}', 'axle = {x_P: steps(1 m, 2 m, 40), gamma_G: steps(1, 2, 30)}'));
    expect(s.diagnostics.map((d) => `${d.line} ${d.ruleId} ${d.message}`)).toEqual([
      '20 cases/limit axle: this line asks for 1200 cases (40 × 30), 1201 in the document so far; at most 1000 are evaluated. Use fewer steps.',
    ]);
    expect(s.cases).toEqual([]);
  });

  it('every error above makes check exit 2 (an error diagnostic)', async () => {
    const s = await evaluated(withCases('STR = {gamma_G: 1.35 m}', 'axle = {x_P: 1 m}'));
    expect(s.diagnostics.some((d) => d.severity === 'error')).toBe(true);
  });
});

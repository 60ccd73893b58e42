/**
 * Slips caught where they happen, in detail: the words and the column of an unknown field (before
 * evaluation and at it), what dependents of a name defined twice say, front matter errors at their
 * own place, names in any script mathjs reads, and kernel messages in the document's units.
 * Every value is invented for the test.
 */
import { describe, it, expect } from 'vitest';
import { compile, evaluateDocument } from '../../engine/index.js';
import { symbolTex } from '../../engine/render/names.js';
import { fence } from '../helpers/settle.js';

const RING = 'r = arch_ring({shape: "circular", span: 6 m, rise: 1.5 m, thickness: 0.34 m, unit_weight: 18 kN/m^3})';

describe('unknown fields', () => {
  it('compile reports a misspelled field of a kernel result at the field, with a suggestion and the list of fields', () => {
    const doc = compile(fence('calc', RING, 'a = arch_limit(r)', 'x = a.laod_factor'));
    expect(doc.diagnostics).toEqual([expect.objectContaining({
      ruleId: 'graph/unknown-field', line: 4, column: 7, endColumn: 18, cellId: 'x', severity: 'error',
      message: 'arch_limit result has no field "laod_factor"; did you mean "load_factor"? Its fields: H_min, H_max, V_left, V_right, t_min, gsf, gsf_definition, hinges, load_factor, mechanism, governs, sigma_max, sigma_max_at, sliding, load_spread, safe, notes',
    })]);
  });

  it('compile reports a misspelled field of a record the document writes', () => {
    const doc = compile(fence('calc', 'loads = {fill_level: 2 m, dead: 3 kN/m^2}', 'z = 1 + loads.fil_level / 1 m'));
    expect(doc.diagnostics).toMatchObject([{ line: 3, column: 15, message: 'record "loads" has no field "fil_level"; did you mean "fill_level"? Its fields: fill_level, dead' }]);
  });

  it('evaluation reports a field of a record whose shape only shows once computed, at the same column', async () => {
    const text = fence('calc', 'p = {fill_level: 2 m}', 'q = {fill_level: 3 m}', 'pick = true ? p : q', 'z = pick.fil_level');
    expect(compile(text).diagnostics).toEqual([]);
    const { summary } = await evaluateDocument(text);
    expect(summary.diagnostics).toMatchObject([{ ruleId: 'graph/unknown-field', line: 5, column: 10, message: 'record "pick" has no field "fil_level"; did you mean "fill_level"? Its fields: fill_level' }]);
    expect(summary.values.z!.text).not.toBe('—');
  });

  it('a dependent of a misspelled field is blocked by it, never computed from a missing value', async () => {
    const { summary } = await evaluateDocument(fence('calc', RING, 'a = arch_limit(r)', 'x = a.laod_factor', 'y = x + 1'));
    expect(summary.values.y).toMatchObject({ value: null, blocked_by: 'x' });
    expect(summary.diagnostics).toHaveLength(1);
  });
});

describe('names defined twice', () => {
  it('what uses the name says it is defined twice, on which lines', async () => {
    const { summary } = await evaluateDocument(fence('given', 'a_w = 3 m', 'a_w = 4 m') + fence('calc', 'q = a_w * 2'));
    expect(summary.values.q!.text).toBe('not computed because "a_w" is defined twice (lines 2 and 3)');
    expect(summary.diagnostics.map((d) => d.ruleId)).toEqual(['graph/duplicate']);
  });
});

describe('front matter errors', () => {
  it('an unclosed quote is reported once, where it opens', () => {
    const doc = compile('---\ntitle: "unclosed\nproject: x\n---\n\ntext\n');
    expect(doc.diagnostics).toMatchObject([{ ruleId: 'parse/front-matter', line: 2, column: 8 }]);
    expect(doc.diagnostics[0]!.message).not.toMatch(/line \d/);
  });

  it('a key given twice is reported on its second line', () => {
    const doc = compile('---\ntitle: a\nrevision: A\ntitle: b\n---\n');
    expect(doc.diagnostics).toMatchObject([{ line: 4, column: 1, message: 'front matter: "title" is given twice; keep one' }]);
  });
});

describe('names', () => {
  it('Greek and accented names are names: γ, λ_req, Länge', async () => {
    const { summary } = await evaluateDocument(fence('given', 'γ = 18 kN/m^3', 'λ_req = 2', 'Länge = 6 m') + fence('calc', 'w = γ * Länge * 1 m to kN/m', 'k = 2 * λ_req'));
    expect(summary.diagnostics).toEqual([]);
    expect(summary.values.w).toMatchObject({ value: 108, unit: 'kN/m' });
    expect(summary.values.k).toMatchObject({ value: 4 });
  });

  it('Greek names are typeset as Greek', () => {
    expect(symbolTex('γ')).toBe('\\gamma');
    expect(symbolTex('γ_M')).toBe('{\\gamma}_{M}');
    expect(symbolTex('λ1')).toBe('{\\lambda}_{1}');
    expect(symbolTex('Länge')).toBe('\\textit{Länge}');
  });

  it.each([
    ['σ₁ = 3 MPa', '"σ₁" cannot be a name: "₁" is not a letter, digit or _; write "σ_1"'],
    ['2x = 3 m', '"2x" cannot be a name: a name starts with a letter or _; write "x_2"'],
    ["L' = 3 m", '"L\'" cannot be a name: "\'" is not a letter, digit or _; write "L_p"'],
    ['in = 3 m', '"in" cannot be a name: it is a word of the expression syntax (unit conversion); write "in_1" or a descriptive name'],
  ])('a refused name says why and what to write: %s', (line, message) => {
    expect(compile(fence('given', line, 'ok = 1 m')).diagnostics).toMatchObject([{ ruleId: 'parse/name', line: 2, message }]);
  });
});

describe('messages in the document\'s units', () => {
  const messageOf = async (...lines: string[]) => (await evaluateDocument(fence('calc', ...lines))).summary.diagnostics.map((d) => d.message);

  it('a kernel quotes the value as the document wrote it, not in SI', async () => {
    expect(await messageOf('w = buttress({height: 6 m, width: 1.5 m, depth: 1 m, unit_weight: 20 kN/m^3, T: -10 kN, z_T: 6 m})'))
      .toEqual(['buttress: T must be zero or more, got −10 kN']);
    expect(await messageOf('r = arch_ring({shape: "circular", radius: 3 m, half_angle: 0 deg, thickness: 0.3 m, unit_weight: 18 kN/m^3})'))
      .toEqual(['arch_ring: half_angle must be positive, got 0 deg']);
  });

  it('a computed value is quoted to the document\'s significant figures', async () => {
    const { summary } = await evaluateDocument(`---\nsigfigs: 3\n---\n${fence('calc', 'r = arch_ring({shape: "circular", span: 6 m, rise: 1.5 m, thickness: 1.2 m - 1.30117647058823565 m, unit_weight: 18 kN/m^3})')}`);
    expect(summary.diagnostics.map((d) => d.message)).toEqual(['arch_ring: thickness must be positive, got −0.101 m']);
  });

  it('lb/ft^3 where a unit weight is meant is called a mass density, with what to write', async () => {
    expect(await messageOf('r = arch_ring({shape: "circular", span: 6 m, rise: 1.5 m, thickness: 0.3 m, unit_weight: 112 lb/ft^3})'))
      .toEqual(['arch_ring: unit_weight needs unit weight (N/m^3), got density (lb/ft^3): lb/ft^3 is a mass density, not a weight; write lbf/ft^3, or multiply by gravity']);
  });

  it('a unit mismatch names dimensions and the units written, not mathjs\'s combined units', async () => {
    expect(await messageOf('x = 2 kN * 3 N / (18 kN/m^3 * 1 kN) to m')).toEqual(['cannot convert volume (m^3) to length (m) in "2 kN * 3 N / (18 kN / m ^ 3 * 1 kN) to m"']);
  });

  it('ksf and kcf are units: 1 ksf = 1000 lbf/ft², 1 kcf = 1000 lbf/ft³ (NIST SP 811, Appendix B)', async () => {
    const { summary } = await evaluateDocument(fence('calc', 'p = 1 ksf to kN/m^2', 'g_w = 1 kcf to kN/m^3'));
    expect(summary.values.p!.value).toBeCloseTo(47.880259, 5);
    expect(summary.values.g_w!.value).toBeCloseTo(157.087464, 5);
  });

  it('atan2 of two forces is an angle, shown in degrees', async () => {
    const { summary } = await evaluateDocument(fence('calc', 'theta = atan2(40 kN, 30 kN)'));
    expect(summary.values.theta).toMatchObject({ unit: 'deg', text: '53.13 deg' });
  });
});

import { describe, expect, it } from 'vitest';
import katex from 'katex';
import { parseExpression, math } from '../../../cells/math.js';
import { exprTex, type TexScope } from '../../../engine/render/tex.js';
import { symbolTex } from '../../../engine/render/names.js';

// Values a document might hold: quantities in their own units, a plain number, a kernel-like record.
const values: Record<string, unknown> = {
  w: math.unit(12, 'kN/m'), L: math.unit(6.4, 'm'), f: math.unit(1.6, 'm'), x: -2, n: 3,
  a: { H_min: math.unit(17090, 'N'), gsf: 2.345 },
};
const scope: TexScope = {
  sigfigs: 4,
  isDefined: (name) => name in values,
  resolve: (path) => {
    let v: unknown = values[path[0]!];
    for (const k of path.slice(1)) v = (v as Record<string, unknown> | undefined)?.[k];
    return v === undefined ? undefined : { value: v, unit: null };
  },
};
const tex = (s: string, substitute = false) => exprTex(parseExpression(s), scope, substitute);

describe('symbolTex(name)', () => {
  // Typesetting conventions: Greek letters by name, descriptive subscripts upright (ISO 80000-2), operator words as \max.
  it.each([
    ['N_phi', '{N}_{\\varphi}'],
    ['gamma_M', '{\\gamma}_{M}'],
    ['sigma_max', '{\\sigma}_{\\max}'],
    ['sigma_c_max', '{\\sigma}_{c,\\max}'],
    ['H_wall', '{H}_{\\mathrm{wall}}'],
    ['L2', '{L}_{2}'],
    ['Delta_H', '{\\Delta}_{H}'],
    ['gamma', '\\gamma'],
    ['t', 't'],
    ['span', '\\mathrm{span}'],
    // Issue 16: several letters are one word, upright as written, never a word with a subscript.
    ['load_factor', '\\mathrm{load\\_factor}'],
    ['end_shear', '\\mathrm{end\\_shear}'],
    ['VG', '\\mathrm{VG}'],
    ['H_min', '{H}_{\\min}'],
    ['epsilon_1', '{\\varepsilon}_{1}'],
  ])('symbolTex(%s) is %s', (name, expected) => {
    expect(symbolTex(name)).toBe(expected);
  });

  it('symbolTex gives TeX that KaTeX parses for odd names', () => {
    for (const name of ['a__b', '_x', 'alpha_beta_gamma', 'x1_y2', 'max_min']) {
      expect(() => katex.renderToString(symbolTex(name), { throwOnError: true })).not.toThrow();
    }
  });
});

describe('exprTex(node, scope)', () => {
  it('exprTex typesets a fraction with implicit products and powers', () => {
    expect(tex('w*L^2/(8 f)')).toBe('\\frac{w\\,{L}^{2}}{8\\,f}');
  });

  it('exprTex substitutes values with units, bracketing powers of quantities', () => {
    expect(tex('w*L^2/(8 f)', true)).toBe('\\frac{12\\,\\mathrm{kN}/\\mathrm{m} \\cdot {(6.4\\,\\mathrm{m})}^{2}}{8 \\cdot 1.6\\,\\mathrm{m}}');
  });

  it('exprTex writes a number with its unit as a quantity, not a product of names', () => {
    expect(tex('18 kN/m^3')).toBe('18\\,\\mathrm{kN}/\\mathrm{m}^{3}');
    expect(tex('30 deg')).toBe('30{}^{\\circ}');
  });

  it('exprTex shows a field access as name.field and substitutes its value in engineering units', () => {
    expect(tex('a.H_min to kN')).toBe('a{.}{H}_{\\min}');
    expect(tex('a.H_min to kN', true)).toBe('17.09\\,\\mathrm{kN}');
  });

  it('exprTex brackets a substituted negative value where a sign would be misread', () => {
    expect(tex('-x^2', true)).toBe('-{(-2)}^{2}');
    expect(tex('L - x', true)).toBe('6.4\\,\\mathrm{m} - (-2)');
    expect(tex('n * x', true)).toBe('3 \\cdot (-2)');
  });

  it('exprTex keeps the brackets the author wrote around sums', () => {
    expect(tex('(L - f)^2')).toBe('{(L - f)}^{2}');
    expect(tex('L - (f - x)')).toBe('L - (f - x)');
  });

  it('exprTex writes nested fractions inline and exponents as a/b', () => {
    expect(tex('(L^2/4 + f^2) / (2 f)')).toBe('\\frac{{L}^{2}/4 + {f}^{2}}{2\\,f}');
    expect(tex('x^(1/2)')).toBe('{x}^{1/2}');
  });

  it('exprTex writes functions the way engineers do', () => {
    expect(tex('sqrt(L^2 + f^2)')).toBe('\\sqrt{{L}^{2} + {f}^{2}}');
    expect(tex('abs(x)')).toBe('\\left|x\\right|');
    expect(tex('atan(f / L)')).toBe('\\arctan\\left(\\frac{f}{L}\\right)');
    expect(tex('max(L, f)')).toBe('\\max(L,\\allowbreak\\,f)');
    expect(tex('arch_limit(a)')).toBe('\\operatorname{arch\\_limit}(a)');
  });

  it('exprTex typesets comparisons with ≤ and ≥', () => {
    expect(tex('a.gsf >= 2')).toBe('a{.}\\mathrm{gsf} \\ge 2');
    expect(tex('a.gsf >= 2', true)).toBe('2.345 \\ge 2');
    expect(tex('w <= 2 * w')).toBe('w \\le 2\\,w');
  });

  it('exprTex escapes text constants so they cannot break out of \\text{}', () => {
    const out = tex('"}\\\\href{javascript:x}{y}"');
    expect(out).not.toContain('\\href');
    expect(() => katex.renderToString(out, { throwOnError: true })).not.toThrow();
  });

  it('exprTex output parses in KaTeX for every node type it handles', () => {
    const exprs = ['a ? L : f', '[L, f]', '{span: L, rise: f}', '1:3', 'x!', 'not (x > 1)', 'x > 1 and n < 4', 'L mod f', 'exp(x)', 'floor(x)', 'nthRoot(L, 3)', 'pi * L', 'a.H_min / (L * 1 m)', 'x < L < n'];
    for (const e of exprs) {
      for (const sub of [false, true]) {
        expect(() => katex.renderToString(tex(e, sub), { throwOnError: true }), e).not.toThrow();
      }
    }
  });
});

/**
 * How a document's names are typeset: `N_phi` → N_φ, `gamma_M` → γ_M,
 * `sigma_max` → σ_max, `L2` → L_2, `H_min` → H_min (single letters italic, with
 * subscripts); `span`, `VG`, `load_factor` → upright words, as written.
 */

const GREEK = new Set([
  'alpha', 'beta', 'gamma', 'delta', 'zeta', 'eta', 'theta', 'iota', 'kappa', 'lambda', 'mu', 'nu', 'xi',
  'pi', 'rho', 'sigma', 'tau', 'upsilon', 'chi', 'psi', 'omega',
  'Gamma', 'Delta', 'Theta', 'Lambda', 'Xi', 'Pi', 'Sigma', 'Upsilon', 'Phi', 'Psi', 'Omega',
  'varepsilon', 'vartheta', 'varphi', 'varrho', 'varsigma',
]);
/** Greek letters as mathjs reads them in names, by the TeX name of the letter. */
const UNICODE_GREEK: Record<string, string> = Object.fromEntries([
  ...'αβγδεζηθικλμνξοπρστυφχψω'].map((c, i) => [c, ['alpha', 'beta', 'gamma', 'delta', 'epsilon', 'zeta', 'eta', 'theta', 'iota',
  'kappa', 'lambda', 'mu', 'nu', 'xi', 'omicron', 'pi', 'rho', 'sigma', 'tau', 'upsilon', 'phi', 'chi', 'psi', 'omega'][i]!])
  .concat([['ς', 'varsigma'], ['ϕ', 'phi'], ['ϑ', 'vartheta'], ['ϵ', 'epsilon'], ['Γ', 'Gamma'], ['Δ', 'Delta'], ['Θ', 'Theta'],
    ['Λ', 'Lambda'], ['Ξ', 'Xi'], ['Π', 'Pi'], ['Σ', 'Sigma'], ['Υ', 'Upsilon'], ['Φ', 'Phi'], ['Ψ', 'Psi'], ['Ω', 'Omega']]));

/** A name with letters TeX has no command for (Länge, ℓ): the word in text italic, subscripts as usual. */
function otherLettersTex(name: string): string {
  const [first, ...rest] = name.split('_');
  const word = (w: string) => (/^[A-Za-z0-9]+$/.test(w) ? subscriptPart(w) : `\\textit{${w.replace(/[\\{}$&#^%~]/g, '')}}`);
  const base = word(first ?? '');
  const parts = rest.filter((p) => p !== '').map(word);
  return parts.length ? `{${base}}_{${parts.join(',')}}` : base;
}

/** Engineering texts write these in their open forms. */
const GREEK_ALIAS: Record<string, string> = { phi: '\\varphi', epsilon: '\\varepsilon', omicron: 'o' };
/** Subscripts typeset as upright operator words. */
const OPERATOR_WORDS = new Set(['max', 'min', 'sup', 'inf', 'lim', 'log', 'ln', 'exp']);

function greekTex(word: string): string | null {
  if (word in GREEK_ALIAS) return GREEK_ALIAS[word]!;
  return GREEK.has(word) ? `\\${word}` : null;
}

/** One part of a subscript: a Greek letter, an operator word, digits, a letter, or an upright word. */
function subscriptPart(part: string): string {
  const greek = greekTex(part);
  if (greek) return greek;
  if (OPERATOR_WORDS.has(part)) return `\\${part}`;
  if (/^\d+$/.test(part) || /^[A-Za-z]$/.test(part)) return part;
  return `\\mathrm{${part}}`;
}

/** The base of a name: a Greek letter, a single letter, or a word in italic; trailing digits become a subscript. */
function baseTex(base: string): { tex: string; digits: string | null } {
  const m = /^(.*?[A-Za-z])(\d+)$/.exec(base);
  const stem = m ? m[1]! : base;
  const digits = m ? m[2]! : null;
  const greek = greekTex(stem);
  if (greek) return { tex: greek, digits };
  if (stem.length <= 1) return { tex: stem, digits };
  // A name of several letters is a word, set upright (italic letters side by side read as a product).
  return { tex: `\\mathrm{${stem}}`, digits };
}

/**
 * The TeX for a name written in a document.
 * @param name a cell name such as `N_phi`, `gamma_M`, `sigma_c_max`
 * @returns TeX such as `N_{\varphi}`, `\gamma_{M}`, `\sigma_{c,\max}`
 * @example symbolTex('sigma_max') // "\\sigma_{\\max}"
 */
export function symbolTex(name: string): string {
  // Greek letters written as themselves (γ_M, λ1) are typeset as their TeX names are.
  name = [...name].map((c) => (UNICODE_GREEK[c] ? `${UNICODE_GREEK[c]}\u0000` : c)).join('').replace(/\u0000(?=[_\d]|$)/g, '').replace(/\u0000/g, '_');
  if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(name)) return otherLettersTex(name);
  const [first, ...rest] = name.split('_');
  // A name starting with '_' or with empty parts ("a__b") is shown plainly, escaped.
  if (!first || rest.some((p) => p === '')) return `\\mathit{${name.replace(/_/g, '\\_')}}`;
  const { tex, digits } = baseTex(first);
  // A word with parts (`load_factor`, `end_shear`) is one name: upright, as written, not a word with a subscript.
  if (tex.startsWith('\\mathrm') && rest.length) return `\\mathrm{${name.replace(/_/g, '\\_')}}`;
  const parts = [...(digits ? [digits] : []), ...rest.map(subscriptPart)];
  return parts.length ? `{${tex}}_{${parts.join(',')}}` : tex;
}

/**
 * A field name of a kernel result, as it follows the dot in `a.H_min`.
 * @example fieldTex('H_min') // "{H}_{\\min}"
 */
export function fieldTex(field: string): string {
  return symbolTex(field);
}

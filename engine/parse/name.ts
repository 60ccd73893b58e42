/**
 * Which names a document may define: every name mathjs's parser reads as a symbol — Latin letters,
 * accented Latin (Länge), Greek (γ, λ), letter-like symbols (ℓ), digits after the first character
 * and `_` — except the words of the expression syntax. A refused name is explained, with what to
 * write instead.
 */

/** mathjs's letters (its parser's isAlpha: Latin, Latin-1 and Latin Extended, Greek, letter-like symbols). */
const LETTER = 'A-Za-z_$\\u00C0-\\u02AF\\u0370-\\u03FF\\u2100-\\u214F';

/** Mathematical alphanumeric letters (𝑥, 𝛾), which mathjs also reads as letters: one surrogate pair each. */
const MATH_LETTER = '\\uD835[\\uDC00-\\uDFFF]';
const NAME_CHAR = new RegExp(`^(?:[${LETTER}0-9]|${MATH_LETTER})$`);

/** `name =` at the start of a statement (not `==`). */
export const NAME_PREFIX = new RegExp(`^\\s*((?:[${LETTER}]|${MATH_LETTER})(?:[${LETTER}0-9]|${MATH_LETTER})*)\\s*=(?!=)`);

/** A statement that defines something that looks like a name: `σ₁ = …`, `L' = …`, `2x = …`. */
const ANY_LEFT = /^\s*([^=\s(){}[\]"',;#<>!][^=(){}[\]",;#<>!]*?)\s*=(?!=)/;

/** Words mathjs reads as operators, never as names. */
const SYNTAX_WORDS: Record<string, string> = {
  to: 'unit conversion', in: 'unit conversion', mod: 'the remainder', and: 'logic', or: 'logic', xor: 'logic',
  not: 'logic', end: 'the last index',
};

const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';
const SUPERSCRIPTS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/** A usable spelling of a refused name: σ₁ → σ_1, L' → L_p, a-b → a_b, 2x → x_2. */
function respell(name: string): string {
  let out = '';
  for (const c of name) {
    const sub = SUBSCRIPTS.indexOf(c), sup = SUPERSCRIPTS.indexOf(c);
    if (sub >= 0) out += `_${sub}`;
    else if (sup >= 0) out += `_${sup}`;
    else if (c === "'" || c === '′') out += '_p';
    else if (NAME_CHAR.test(c)) out += c;
    else out += '_';
  }
  out = out.replace(/_+/g, '_').replace(/^_|_$/g, '');
  const lead = /^(\d+)(.*)$/.exec(out);
  if (lead) out = lead[2] ? `${lead[2].replace(/^_/, '')}_${lead[1]}` : `x_${lead[1]}`;
  return out || 'x_1';
}

/**
 * Why a defined name cannot be used, or null when it can.
 * @example nameProblem('σ₁ = 3 MPa') // '"σ₁" cannot be a name: "₁" is not a letter, digit or _; write "σ_1"'
 */
export function nameProblem(statement: string): string | null {
  const ok = NAME_PREFIX.exec(statement);
  if (ok) {
    const why = SYNTAX_WORDS[ok[1]!];
    return why ? `"${ok[1]}" cannot be a name: it is a word of the expression syntax (${why}); write "${ok[1]}_1" or a descriptive name` : null;
  }
  const left = ANY_LEFT.exec(statement)?.[1];
  if (!left) return null;
  const bad = [...left].find((c) => !NAME_CHAR.test(c));
  if (/^\d/.test(left)) return `"${left}" cannot be a name: a name starts with a letter or _; write "${respell(left)}"`;
  if (!bad) return null;
  const shown = bad === ' ' ? 'a space' : `"${bad}"`;
  return `"${left}" cannot be a name: ${shown} is not a letter, digit or _; write "${respell(left)}"`;
}

/**
 * mathjs's own error messages, said in the words of a calc: no function signatures, no JavaScript
 * types, no internal function names ("Unexpected type of argument in function multiplyScalar
 * (expected: number or Complex …, actual: identifier | undefined, index: 0)" becomes "cannot use a
 * missing value in "*"").
 */

const TYPE_WORDS: Array<[RegExp, string]> = [
  [/identifier \| undefined|undefined|null/, 'a missing value'],
  [/Unit/, 'a quantity with a unit'],
  [/number|BigNumber|Fraction|bigint/, 'a plain number'],
  [/string/, 'text'],
  [/boolean/, 'true/false'],
  [/Array|Matrix/, 'a list'],
  [/Object/, 'a record'],
  [/function/, 'a function'],
];

const OPERATORS: Record<string, string> = {
  add: '"+"', subtract: '"−"', multiply: '"*"', divide: '"/"', pow: '"^"', mod: '"mod"', unaryMinus: 'a minus sign',
  unaryPlus: 'a plus sign', smaller: 'a comparison', smallerEq: 'a comparison', larger: 'a comparison', largerEq: 'a comparison',
  equal: 'a comparison', unequal: 'a comparison', and: '"and"', or: '"or"', not: '"not"', to: 'a unit conversion',
};

/** What a type name of mathjs's signatures is, in words. */
function typeWords(type: string): string {
  return TYPE_WORDS.find(([re]) => re.test(type))?.[1] ?? 'this value';
}

/** A function of a signature message, as the document writes it: "+" for addScalar, min(…) for min. */
function functionWords(fn: string): string {
  const name = fn.replace(/Scalar$|Number$|Unit$/, '');
  return OPERATORS[name] ?? `${name}(…)`;
}

/**
 * mathjs's message in plain words (other messages are returned unchanged, less any "(char N)").
 * @example plainWords('Unexpected type of argument in function addScalar (expected: number, actual: identifier | undefined, index: 0)')
 * // 'cannot use a missing value in "+"'
 */
export function plainWords(message: string): string {
  let m = /Unexpected type of argument in function (\w+) \(expected: ([^)]*?), actual: ([^,)]*)(?:, index: \d+)?\)/.exec(message);
  if (m) {
    const expected = [...new Set(m[2]!.split(' or ').map(typeWords))].filter((w) => w !== 'this value').join(' or ');
    return `cannot use ${typeWords(m[3]!)} in ${functionWords(m[1]!)}${expected ? `; it takes ${expected}` : ''}`;
  }
  m = /Too few arguments in function (\w+)/.exec(message);
  if (m) return `${functionWords(m[1]!)} needs more arguments, or arguments of another kind`;
  m = /Unit in function (\w+) is no angle/.exec(message);
  if (m) return `${functionWords(m[1]!)} needs an angle (e.g. 30 deg) or a plain number`;
  m = /Too many arguments in function (\w+) \(expected: (\d+), actual: (\d+)\)/.exec(message);
  if (m) return `${functionWords(m[1]!)} takes ${m[2]} argument${m[2] === '1' ? '' : 's'}, got ${m[3]}`;
  m = /Index out of range \((-?\d+) [<>] (-?\d+)\)/.exec(message);
  if (m) return `there is no item ${m[1]} in this list (items are counted from 1)`;
  m = /Cannot convert "([^"]*)" to a number/.exec(message);
  if (m) return `"${m[1]}" is text, not a number`;
  m = /Undefined (?:symbol|function) (\S+)/.exec(message);
  if (m) return `unknown name "${m[1]}"`;
  m = /Cannot access method "([^"]+)" as a property/.exec(message);
  if (m) return `"${m[1]}" is not a field of this value`;
  if (/Dimension mismatch/.test(message)) return 'the lists have different lengths';
  return message.replace(/\s*\(char \d+\)/g, '').replace(/\bundefined\b/g, 'a missing value');
}

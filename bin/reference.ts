/**
 * The kernel reference: one text per cell function, generated from its registration (parameters,
 * units, required options, result fields) and the `reference` text written beside it. The same
 * text is what `vaultbook help NAME` prints and what docs/kernel.md holds (`npm run docs`).
 * Pure: no Node imports.
 */
import type { CellFunction, FieldType, ParamSpec } from '../cells/define.js';

/** One declared argument, option or result field, by its dotted path. */
export interface DeclaredEntry {
  path: string;
  type: FieldType;
  /** Arguments only: must the document give it? */
  required?: boolean;
}

/** Dimension names and the unit the outputs show them in, for the SI unit strings registrations use. */
const DIMENSIONS: Record<string, string> = {
  m: 'length, m',
  'm^2': 'area, m²',
  N: 'force, N (shown in kN)',
  'N/m': 'force per unit length, N/m (shown in kN/m)',
  Pa: 'stress or pressure, Pa (shown in kN/m², or MPa from 1 MPa up)',
  'N/m^3': 'unit weight (force per volume), N/m³ (shown in kN/m³)',
  rad: 'angle (give it in deg or rad; shown in degrees)',
  '1': 'plain number',
  count: 'whole number',
  text: 'text in quotes',
  boolean: 'true or false',
  any: 'number or quantity',
};

/**
 * What a value of this type is, in words.
 * @example dimensionOf('N/m') // "force per unit length, N/m (shown in kN/m)"
 */
export function dimensionOf(type: FieldType): string {
  if (typeof type === 'string') return DIMENSIONS[type] ?? `quantity in ${type}`;
  if ('ref' in type || 'refWithArgs' in type) return `result of ${'ref' in type ? type.ref : type.refWithArgs}(…)`;
  if ('list' in type) return typeof type.list === 'object' && 'object' in type.list ? 'list of records' : `list (each: ${dimensionOf(type.list)})`;
  return 'record';
}

/** The entries of a record or a list of records under `prefix` (a list's entries are its items' fields). */
function nested(type: FieldType, prefix: string, out: DeclaredEntry[]): void {
  const inner = typeof type === 'object' && 'list' in type ? type.list : type;
  if (typeof inner !== 'object' || !('object' in inner)) return;
  for (const [key, field] of Object.entries(inner.object)) {
    const path = prefix ? `${prefix}.${key}` : key;
    out.push({ path, type: field });
    nested(field, path, out);
  }
}

/**
 * Every argument and option a function declares: `options`, `options.shape`, `loads.P`, …
 * @example declaredParams(arch_limit).map((e) => e.path) // ['ring', 'loads', 'loads.fill_unit_weight', …]
 */
export function declaredParams(fn: CellFunction): DeclaredEntry[] {
  const out: DeclaredEntry[] = [];
  fn.params.forEach((p: ParamSpec, i) => {
    out.push({ path: p.name, type: p.type, required: !p.optional });
    const before = out.length;
    nested(p.type, p.name, out);
    // Required options are named by their key in the first (options) argument.
    for (const e of out.slice(before)) e.required = i === 0 && fn.required.includes(e.path.slice(p.name.length + 1));
  });
  return out;
}

/**
 * Every result field a function declares: `H_min`, `hinges`, `hinges.angle`, …; a function that
 * returns anything but a record declares `result` (and, for a list of records, its items' fields).
 */
export function declaredFields(fn: CellFunction): DeclaredEntry[] {
  const isRecord = typeof fn.returns === 'object' && 'object' in fn.returns;
  const out: DeclaredEntry[] = isRecord ? [] : [{ path: 'result', type: fn.returns }];
  nested(fn.returns, '', out);
  return out;
}

/** Declared entries that have no reference text: what the completeness test reports. */
export function missingReference(fn: CellFunction): string[] {
  const ref = fn.reference;
  const missing = [
    ...declaredParams(fn).filter((e) => !ref.params?.[e.path]).map((e) => `argument ${e.path}`),
    ...declaredFields(fn).filter((e) => !ref.fields?.[e.path]).map((e) => `result field ${e.path}`),
  ];
  if (!ref.method) missing.push('method');
  return missing;
}

/** Reference text that names nothing declared (a typo, or a field since removed). */
export function strayReference(fn: CellFunction): string[] {
  const params = new Set(declaredParams(fn).map((e) => e.path));
  const fields = new Set(declaredFields(fn).map((e) => e.path));
  return [
    ...Object.keys(fn.reference.params ?? {}).filter((k) => !params.has(k)).map((k) => `argument ${k}`),
    ...Object.keys(fn.reference.fields ?? {}).filter((k) => !fields.has(k)).map((k) => `result field ${k}`),
  ];
}

/** How the function is called: `arch_limit(ring, [loads])`. */
export function signature(fn: CellFunction): string {
  return `${fn.name}(${fn.params.map((p) => (p.optional ? `[${p.name}]` : p.name)).join(', ')})`;
}

const item = (path: string, what: string, text: string | undefined) => `- \`${path}\` — ${what}. ${text ?? '(no reference text)'}`;

/**
 * The reference entry of one function, as markdown that also reads as plain text in a terminal.
 * @example referenceText(cellFunctions.get('tie')!) // "## tie(options)\n\nSteel tie …"
 */
export function referenceText(fn: CellFunction): string {
  const ref = fn.reference;
  const lines = [`## ${signature(fn)}`, '', fn.doc, '', '### Arguments', ''];
  for (const e of declaredParams(fn)) {
    lines.push(item(e.path, `${dimensionOf(e.type)}; ${e.required ? 'required' : 'optional'}`, ref.params?.[e.path]));
  }
  lines.push('', '### Result', '');
  for (const e of declaredFields(fn)) lines.push(item(e.path, dimensionOf(e.type), ref.fields?.[e.path]));
  lines.push('', '### Method', '', ref.method ?? '(not described)');
  if (ref.assumptions?.length) lines.push('', '### Assumptions', '', ...ref.assumptions.map((a) => `- ${a}`));
  lines.push('', '### Sources', '', ...(ref.sources?.length ? ref.sources.map((s) => `- ${s}`) : ['- None cited: the method is stated above.']));
  return lines.join('\n');
}

/** In alphabetical order, whatever order the module system listed them in. */
function byName(fns: CellFunction[]): CellFunction[] {
  return [...fns].sort((a, b) => (a.name < b.name ? -1 : 1));
}

/** First sentence of a function's one-line description, for the list, at most about a line long. */
function summaryOf(fn: CellFunction): string {
  const first = /^(.*?\.)\s+(?=[A-Z])/.exec(fn.doc)?.[1] ?? fn.doc;
  return first.length > 110 ? `${first.slice(0, 109).replace(/\s+\S*$/, '')} …` : first;
}

/**
 * The list `vaultbook help` prints: each function's call and what it does.
 * @example functionList([...cellFunctions.values()])
 */
export function functionList(fns: CellFunction[]): string {
  fns = byName(fns);
  const width = Math.max(...fns.map((f) => signature(f).length));
  return fns.map((f) => `  ${signature(f).padEnd(width)}  ${summaryOf(f)}`).join('\n');
}

/** docs/kernel.md: a contents list, the conventions every entry relies on, and every entry. */
export function referenceDocument(fns: CellFunction[]): string {
  fns = byName(fns);
  return [
    '# Kernel reference',
    '',
    '<!-- Generated by `npm run docs` from the registrations in cells/ (their `reference` text). Do not edit by hand:',
    '     test/cli/reference.test.ts fails when this file differs from what the registrations give. -->',
    '',
    'Every function a cell may call, with its arguments, its result fields, the method and the sources.',
    '`vaultbook help NAME` prints the same text for one function.',
    '',
    '**Conventions.** Quantities go in with any unit of the right dimension (`6.4 m`, `18 kN/m^3`, `30 deg`) and come',
    'out in SI, shown in engineering units. Forces in the membrane functions are per unit length, compression',
    'negative. Records of options are written `{name: value, …}`; an option marked required must be given.',
    '',
    ...fns.map((f) => `- [${f.name}](#${f.name}) — ${summaryOf(f)}`),
    '',
    ...fns.flatMap((f) => [`<a id="${f.name}"></a>`, '', referenceText(f), '']),
  ].join('\n');
}

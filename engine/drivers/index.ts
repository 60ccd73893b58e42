/**
 * What drives each check: the `given` inputs it depends on through every path of the graph, and how
 * much each moves it.
 *
 * For every input: the elasticity of the check's utilization, d ln u / d ln x, by a central difference
 * with a small relative step in the input's own units (one-sided values beside it, and `kinked` where
 * they differ); and the utilization at the input −10 % and +10 % (the swing). Inputs are ranked by the
 * size of the swing. A check without a utilization (`<`, `>`, true/false) gives its verdict at ±10 %.
 * With cases, a check is explained in its governing case. Only the dirty subgraph of each move is
 * re-evaluated, on one session of the compiled document.
 */
import { compile, startSession, type CompileOptions } from '../index.js';
import type { Diagnostic } from '../diagnostic.js';
import type { CompiledDocument } from '../types.js';
import type { Session } from '../runtime/bind.js';
import { summarise } from '../summary.js';
import { suggestName } from '../graph/suggest.js';
import { judgeCases, findCase, type Case } from '../cases/index.js';
import { toJsonValue } from '../values/json.js';
import { documentUnitSystem, type FormatOptions } from '../values/format.js';
import { inputsOf } from './depends.js';
import { stepsFor, type InputSteps } from './steps.js';
import { elasticityOf, swingOf } from './measure.js';
import { perturbInputs, type Group, type Perturbation, type PerturbLog, type Target } from './perturb.js';
import { prunedDocument } from './prune.js';

/** One input of one check or value: how much it moves it. */
export interface InputDriver {
  name: string;
  /** The input's value where the check is explained (its governing case). */
  text: string;
  elasticity: number | null;
  /** Utilization (checks) at the input −10 % and +10 %; null where it is not defined or not computed. */
  u_minus: number | null;
  u_plus: number | null;
  kinked: boolean;
  /** One-sided elasticities (below and above the value). */
  elasticity_minus: number | null;
  elasticity_plus: number | null;
  /** Checks: the verdict at −10 % and +10 %. */
  pass_minus?: boolean | null;
  pass_plus?: boolean | null;
  /** Named values: the value at −10 % and +10 %, as text. */
  value_minus?: string | null;
  value_plus?: string | null;
  /** The swing's step: `±10 %`, or an absolute step for an input at zero (`±0.1 m`). */
  step: string;
  /** Why the input was not varied (not a number), or why the check was not computed on one side. */
  note?: string;
}

export interface CheckDrivers {
  name: string;
  source: string;
  line: number;
  utilization: number | null;
  pass: boolean | null;
  /** The case the check is explained in (its governing case); null for the document as written. */
  case: string | null;
  inputs: InputDriver[];
}

export interface ValueDrivers {
  name: string;
  line: number;
  text: string;
  case: string | null;
  inputs: InputDriver[];
}

export interface Explanation {
  file: string;
  checks: CheckDrivers[];
  values: ValueDrivers[];
  diagnostics: Diagnostic[];
  /** Cost of the moves: settles, cell evaluations, and the inputs each settle changed. */
  stats: { settles: number; evaluations: number; changes: string[][] };
  /** With `part`: per target (checks, then values, in order), every input in document order with its ranking size; `own` when this part gives it. */
  moved?: Array<Array<{ input: string; size: number; own: boolean }>>;
}

export interface ExplainOptions extends CompileOptions {
  /** Checks and named values to explain (names, or ids such as `check@L30`); every check when absent or empty. */
  targets?: string[];
  /** Explain one case as if its inputs were written in (`--case NAME`). */
  case?: string;
  /** Move only every `of`-th input, starting at `index` (one thread's share; merge the parts with mergeExplanations). */
  part?: { index: number; of: number };
}

const clean = (x: number | null): number | null => (x === null || !Number.isFinite(x) ? null : Number(x.toPrecision(12)));

function unknownTarget(doc: CompiledDocument, name: string): Diagnostic {
  const known = doc.graph.cells.filter((c) => c.kind !== 'cases').map((c) => c.name ?? c.id);
  const guess = suggestName(name, known);
  return {
    message: `explain ${name}: no check or value of that name${guess ? `; did you mean "${guess}"?` : ''}`,
    file: doc.file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId: 'explain/unknown-name', severity: 'error',
  };
}

function totalEvaluations(session: Session): number {
  let n = 0;
  for (const v of session.evaluations.values()) n += v;
  return n;
}

/** Ranked, biggest swing first; a verdict that flips counts before one that does not. Ties keep document order. */
function rank(list: Array<{ entry: InputDriver; size: number }>): InputDriver[] {
  return list.map((x, i) => ({ ...x, i })).sort((a, b) => b.size - a.size || a.i - b.i).map((x) => x.entry);
}

function driverOf(name: string, text: string, steps: InputSteps | { reason: string }, p: Perturbation | undefined,
  isCheck: boolean, pass: boolean | null, format: FormatOptions, unit: string | null): { entry: InputDriver; size: number } {
  if ('reason' in steps || !p) {
    const entry: InputDriver = {
      name, text, elasticity: null, u_minus: null, u_plus: null, kinked: false, elasticity_minus: null, elasticity_plus: null,
      ...(isCheck ? { pass_minus: null, pass_plus: null } : { value_minus: null, value_plus: null }), step: '', note: 'reason' in steps ? steps.reason : 'not varied',
    };
    return { entry, size: -1 };
  }
  const e = elasticityOf(p.samples, steps.absolute);
  const text_ = (v: unknown) => (v === undefined || v === null ? null : toJsonValue(v, format, unit).text);
  const entry: InputDriver = {
    name, text, elasticity: clean(e.elasticity),
    u_minus: isCheck ? clean(p.samples.swing[0]) : null, u_plus: isCheck ? clean(p.samples.swing[1]) : null,
    kinked: e.kinked, elasticity_minus: clean(e.elasticity_minus), elasticity_plus: clean(e.elasticity_plus),
    ...(isCheck ? { pass_minus: p.verdicts[0], pass_plus: p.verdicts[1] } : { value_minus: text_(p.values[0]), value_plus: text_(p.values[1]) }),
    step: steps.swingText,
  };
  const [below, above] = p.failures;
  if (below !== null || above !== null) {
    entry.note = below === above ? `not computed either side: ${below}` : [below && `not computed below the value: ${below}`, above && `not computed above the value: ${above}`].filter(Boolean).join('; ');
  }
  // Without a measure, the size is how many sides flip the verdict.
  const size = p.samples.at !== null ? swingOf(p.samples) : p.verdicts.filter((v) => v !== null && v !== pass).length;
  return { entry, size };
}

/**
 * Explains checks and named values of a document.
 * @param source the markdown text
 * @returns per check its inputs ranked by swing; never throws on bad input (problems are diagnostics)
 * @example const {checks} = await explainDocument(text, {file: 'calc.md', targets: ['c_H']})
 */
export async function explainDocument(source: string, options: ExplainOptions = {}): Promise<Explanation> {
  let doc = compile(source, options);
  const extra: Diagnostic[] = [];
  let shown: string | null = null;
  // The whole document is evaluated once for its diagnostics (and to find a case); a thread that
  // moves a later share of the inputs leaves that to the first.
  let found: Diagnostic[] = [];
  if (!options.part || options.part.index === 0 || options.case !== undefined) {
    let whole = startSession(doc);
    if (options.case !== undefined) {
      const c = await findCase(doc, whole, options.case);
      if ('case' in c) {
        whole.dispose();
        doc = compile(source, { ...options, overrides: { ...c.case.overrides, ...options.overrides } });
        whole = startSession(doc);
        shown = c.case.name;
        extra.push(...c.diagnostics);
      } else extra.push(c.error);
    }
    const asWritten = new Map(await whole.settle());
    found = summarise(doc, asWritten, new Map(whole.warnings)).diagnostics.map(({ cell: _cell, ...d }) => d as Diagnostic);
    whole.dispose();
  }
  const sigfigs = typeof doc.meta.sigfigs === 'number' ? doc.meta.sigfigs : 4;

  // What to explain: the targets asked for, else every check.
  const asked = options.targets ?? [];
  const targets: Target[] = [];
  if (asked.length === 0) for (const c of doc.graph.cells) { if (c.kind === 'check') targets.push({ id: c.id, isCheck: true }); }
  for (const name of asked) {
    const cell = doc.graph.cells.find((c) => c.kind !== 'cases' && (c.name === name || c.id === name));
    if (!cell) extra.push(unknownTarget(doc, name));
    else if (!targets.some((t) => t.id === cell.id)) targets.push({ id: cell.id, isCheck: cell.kind === 'check' });
  }

  // Only what the targets need is evaluated from here on (and what the cases' expressions read).
  const full = doc;
  doc = prunedDocument(full, targets.map((t) => t.id));
  const session = startSession(doc);
  const written = new Map(await session.settle());
  // Values in the document's units (kip, ft … for a calc written in US customary units).
  const format: FormatOptions = { sigfigs, units: documentUnitSystem(doc) };

  // With cases, each check is explained in its governing case.
  const caseOf = new Map<string, Case | null>();
  if (shown === null && doc.cases.lines.length > 0 && targets.some((t) => t.isCheck)) {
    const run = await judgeCases(doc, session, new Map(written), { restore: true });
    extra.push(...run.diagnostics.filter((d) => !full.diagnostics.includes(d)));
    for (const t of targets) {
      const governing = t.isCheck ? run.checks.get(t.id)?.governing?.case ?? null : null;
      caseOf.set(t.id, governing === null ? null : run.cases.find((c) => c.name === governing) ?? null);
    }
  }
  const depends = new Map(targets.map((t) => [t.id, inputsOf(doc.graph, t.id)]));
  const keyed = new Map<string | null, { case: Case | null; group: Group }>();
  for (const t of targets) {
    const c = caseOf.get(t.id) ?? null;
    const key = c?.name ?? null;
    if (!keyed.has(key)) keyed.set(key, { case: c, group: { overrides: c?.overrides ?? {}, targets: [], steps: new Map(), base: new Map() } });
    keyed.get(key)!.group.targets.push(t);
  }
  const groups = [...keyed.values()];
  // Each input moves from its value in the group's case; one that cannot be moved says why.
  const refused = groups.map(() => new Map<string, string>());
  const texts = groups.map(() => new Map<string, string>());
  groups.forEach(({ case: c, group }, gi) => {
    for (const id of new Set(group.targets.flatMap((t) => depends.get(t.id)!))) {
      const cell = doc.graph.byId.get(id)!;
      const s = written.get(id);
      const value = c && id in c.values ? c.values[id] : s?.status === 'ok' ? s.value : undefined;
      texts[gi]!.set(id, value === undefined ? 'not computed' : toJsonValue(value, format, cell.displayUnit).text);
      const steps = value === undefined ? { reason: 'not computed as written: not varied' } : stepsFor(cell, value);
      if ('reason' in steps) refused[gi]!.set(id, steps.reason); else group.steps.set(id, steps);
    }
  });

  const log: PerturbLog = { changes: [] };
  const before = totalEvaluations(session);
  const every = doc.graph.cells.filter((c) => c.kind === 'given' && groups.some((g) => g.group.steps.has(c.id))).map((c) => c.id);
  const part = options.part;
  const order = part ? every.filter((_, k) => k % part.of === part.index) : every;
  const mine = new Set(order);
  const moved = await perturbInputs(session, order, groups.map((g) => g.group), (t, input) => depends.get(t)!.includes(input), log,
    (gi, input, message) => refused[gi]!.set(input, `its moved value was refused (${message}): not varied`));
  const checks: CheckDrivers[] = [];
  const values: ValueDrivers[] = [];
  const byId = new Map<string, CheckDrivers | ValueDrivers>();
  const sizes = new Map<string, Array<{ input: string; size: number; own: boolean }>>();
  groups.forEach(({ case: c, group }, gi) => {
    for (const t of group.targets) {
      const cell = doc.graph.byId.get(t.id)!;
      const unit = t.isCheck ? null : cell.displayUnit;
      const r = group.base.get(t.id)!;
      const drivers = depends.get(t.id)!.map((id) => {
        const why = refused[gi]!.get(id);
        return driverOf(id, texts[gi]!.get(id)!, why !== undefined ? { reason: why } : group.steps.get(id)!, moved[gi]!.get(id)?.get(t.id), t.isCheck, r.pass, format, unit);
      });
      // A part reports the inputs it moved; the first part also those that cannot be moved.
      sizes.set(t.id, drivers.map((d, k) => {
        const input = depends.get(t.id)![k]!;
        return { input, size: d.size, own: mine.has(input) || ((!every.includes(input) || refused[gi]!.has(input)) && part?.index === 0) };
      }));
      const ranked = rank(drivers);
      const caseName = shown ?? c?.name ?? null;
      const name = cell.name ?? cell.id;
      const line = cell.span.start.line;
      if (t.isCheck) byId.set(t.id, { name, source: cell.source, line, utilization: clean(r.measure), pass: r.pass, case: caseName, inputs: ranked });
      else byId.set(t.id, { name, line, text: r.value === undefined ? 'not computed' : toJsonValue(r.value, format, unit).text, case: caseName, inputs: ranked });
    }
  });
  for (const t of targets) {
    const entry = byId.get(t.id)!;
    if (t.isCheck) checks.push(entry as CheckDrivers); else values.push(entry as ValueDrivers);
  }
  const stats = { settles: log.changes.length, evaluations: totalEvaluations(session) - before, changes: log.changes };
  session.dispose();
  const diagnostics = [...found, ...extra];
  const shares = part ? [...targets.filter((t) => t.isCheck), ...targets.filter((t) => !t.isCheck)].map((t) => sizes.get(t.id)!) : undefined;
  return { file: doc.file, checks, values, diagnostics, stats, ...(shares ? { moved: shares } : {}) };
}

/**
 * One explanation from the parts of several threads (each moved its share of the inputs): every input
 * from the part that moved it, ranked again; costs summed.
 * @example mergeExplanations(await Promise.all([0, 1].map((index) => explainDocument(text, {part: {index, of: 2}}))))
 */
export function mergeExplanations(parts: readonly Explanation[]): Explanation {
  const [first] = parts;
  if (!first || parts.some((p) => !p.moved)) throw new TypeError('mergeExplanations: expected the parts of explainDocument with options.part');
  const entries = [...first.checks, ...first.values].map((target, k) => {
    const chosen = new Map<string, { entry: InputDriver; size: number }>();
    parts.forEach((p) => {
      const own = [...p.checks, ...p.values][k]!;
      for (const { input, size, own: mine } of p.moved![k]!) if (mine) chosen.set(input, { entry: own.inputs.find((i) => i.name === input)!, size });
    });
    // Document order first, so that ties keep it as on one thread.
    const order = first.moved![k]!.map((x) => x.input).filter((input) => chosen.has(input));
    return { ...target, inputs: rank(order.map((name) => chosen.get(name)!)) };
  });
  const n = first.checks.length;
  return {
    file: first.file, checks: entries.slice(0, n) as CheckDrivers[], values: entries.slice(n) as ValueDrivers[], diagnostics: first.diagnostics,
    stats: {
      settles: parts.reduce((s, p) => s + p.stats.settles, 0), evaluations: parts.reduce((s, p) => s + p.stats.evaluations, 0),
      changes: parts.flatMap((p) => p.stats.changes),
    },
  };
}

export { inputsOf } from './depends.js';
export { SMALL_STEP, SWING_STEP } from './steps.js';
export { KINK_TOLERANCE } from './measure.js';

/**
 * perturbInputs: moves each input in turn on a settled session and reads every target that depends
 * on it, re-evaluating only the dirty subgraph (session.setInput, the same path as --set and a live edit).
 *
 * The work is input-major: for each input and each of its four moves (−small, +small, −10 %, +10 %),
 * the input is set once and then every group of targets is read in its own case, so what lies
 * downstream of the input is re-evaluated once per move and only the (usually light) inputs of the
 * cases change between groups. Nothing is put back between moves; each settle changes only the inputs
 * that differ from the previous one. Every settle is logged with those inputs, so the evaluations can
 * be compared with the sum of the dirty subgraphs.
 */
import type { Session } from '../runtime/bind.js';
import type { CellState, CheckResult } from '../types.js';
import type { Samples } from './measure.js';
import type { InputSteps } from './steps.js';
import { math } from '../../cells/math.js';

/** A check (its utilization, and its verdict) or a named value (its number in SI). */
export interface Target {
  id: string;
  isCheck: boolean;
}

export interface Reading {
  measure: number | null;
  pass: boolean | null;
  /** The value itself (named values only, for its text). */
  value?: unknown;
  /** Why it was not computed: the error of the cell that failed. */
  failure?: string;
}

/** The message of the error that stops a cell (its own, or that of the cell blocking it). */
function failureOf(states: Map<string, CellState>, id: string): string {
  let s = states.get(id);
  for (let hops = 0; s?.status === 'blocked' && hops < 1000; hops++) {
    // Stopped by a field that is not available: the note says which and why (its source cell evaluated fine).
    if (s.note) return `${id}: ${s.note}`;
    id = s.by;
    s = states.get(id);
  }
  return s?.status === 'error' ? `${id}: ${s.diagnostic.message}` : 'not computed';
}

/** What a target shows in one state of the session. */
export function readTarget(states: Map<string, CellState>, t: Target): Reading {
  const s = states.get(t.id);
  if (s?.status !== 'ok') return { measure: null, pass: null, failure: failureOf(states, t.id) };
  if (t.isCheck) {
    const r = s.value as CheckResult;
    return { measure: r.utilization, pass: r.pass };
  }
  const v = s.value;
  if (typeof v === 'number') return { measure: v, pass: null, value: v };
  if (math.isUnit(v) && typeof (v as { value: unknown }).value === 'number') return { measure: (v as { value: number }).value, pass: null, value: v };
  return { measure: null, pass: null, value: v };
}

/** One target's readings under one input's moves. */
export interface Perturbation {
  samples: Samples;
  /** Verdicts at −10 % and +10 % (checks only). */
  verdicts: [boolean | null, boolean | null];
  /** Values at −10 % and +10 % (named values only). */
  values: [unknown, unknown];
  /** Why the target was not computed below and above the value (null where it was). */
  failures: [string | null, string | null];
}

/** Targets read in one case (`overrides` empty for the document as written). */
export interface Group {
  overrides: Record<string, string>;
  targets: Target[];
  /** Input id → its moves in this case (absent: the input is not varied here). */
  steps: Map<string, InputSteps>;
  /** The targets as the case gives them, filled by perturbInputs. */
  base: Map<string, Reading>;
}

export interface PerturbLog {
  /** The inputs each settle changed, in order. */
  changes: string[][];
}

/** Sets exactly the wanted inputs (others back to the document's value) and settles once; null when refused. */
function applier(session: Session, log: PerturbLog) {
  const applied = new Map<string, string>();
  return async (wanted: Record<string, string>): Promise<Map<string, CellState> | string> => {
    const changed: string[] = [];
    for (const input of [...applied.keys()]) {
      if (input in wanted) continue;
      session.resetInput(input);
      applied.delete(input);
      changed.push(input);
    }
    for (const [input, text] of Object.entries(wanted)) {
      if (applied.get(input) === text) continue;
      const refused = session.setInput(input, text);
      if (refused) return `${input} = ${text}: ${refused.message}`;
      applied.set(input, text);
      changed.push(input);
    }
    if (changed.length === 0) return session.states;
    log.changes.push(changed);
    return session.settle();
  };
}

/**
 * @param inputs the inputs to move, in order
 * @param dependsOn whether a target depends on an input
 * @param onRefused an input whose moved value the session refused in a group (it is left out there)
 * @returns group index → input id → target id → readings; the session is back as written at the end
 */
export async function perturbInputs(session: Session, inputs: readonly string[], groups: Group[], dependsOn: (target: string, input: string) => boolean,
  log: PerturbLog, onRefused: (group: number, input: string, message: string) => void): Promise<Array<Map<string, Map<string, Perturbation>>>> {
  const apply = applier(session, log);
  for (const g of groups) {
    const states = await apply(g.overrides);
    if (typeof states === 'string') throw new TypeError(`perturbInputs: a case was refused: ${states}`);
    for (const t of g.targets) g.base.set(t.id, readTarget(states, t));
  }
  const out = groups.map(() => new Map<string, Map<string, Perturbation>>());
  for (const input of inputs) {
    const reading = groups.map((g) => g.targets.filter((t) => g.steps.has(input) && dependsOn(t.id, input)).map(() => [] as Reading[]));
    const refused = new Set<number>();
    for (let k = 0; k < 4; k++) {
      for (const [gi, g] of groups.entries()) {
        const steps = g.steps.get(input);
        const targets = g.targets.filter((t) => dependsOn(t.id, input));
        if (!steps || targets.length === 0 || refused.has(gi)) continue;
        const states = await apply({ ...g.overrides, [input]: [...steps.small, ...steps.swing][k]! });
        if (typeof states === 'string') { refused.add(gi); onRefused(gi, input, states); continue; }
        targets.forEach((t, j) => reading[gi]![j]!.push(readTarget(states, t)));
      }
    }
    groups.forEach((g, gi) => {
      if (refused.has(gi) || !g.steps.has(input)) return;
      const perTarget = new Map<string, Perturbation>();
      g.targets.filter((t) => dependsOn(t.id, input)).forEach((t, j) => {
        const [dn, up, wdn, wup] = reading[gi]![j]!;
        perTarget.set(t.id, {
          samples: { at: g.base.get(t.id)?.measure ?? null, small: [dn!.measure, up!.measure], swing: [wdn!.measure, wup!.measure] },
          verdicts: [wdn!.pass, wup!.pass],
          failures: [dn!.failure ?? wdn!.failure ?? null, up!.failure ?? wup!.failure ?? null],
          values: [wdn!.value, wup!.value],
        });
      });
      out[gi]!.set(input, perTarget);
    });
  }
  await apply({});
  return out;
}

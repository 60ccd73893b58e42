/**
 * The live page's evaluation worker: it owns the compiled document and the engine Session, applies
 * the page's edits, evaluates, renders every changed cell (the same renderer as `vaultbook render`)
 * and posts the HTML back, with each result's move against the document as written. The page then
 * only swaps elements. Protocol: ./protocol.ts.
 */
import '../runtime-turn.js';
import { compile, startSession } from '../../engine/index.js';
import type { CellState, CompiledDocument, Session } from '../../engine/index.js';
import { checkCasesNote, makeRenderContext, renderCasesBlock, renderCellOutput, renderCheckSummary, renderDiagnostics, renderStatus, type RenderContext } from '../sheet.js';
import { compareToDocument } from '../review.js';
import { checksShownByCases, judgeWithTrials, verdictsOverCases } from '../cases.js';
import { explainDocument } from '../../engine/drivers/index.js';
import { renderDriversAppendix } from '../../engine/render/drivers.js';
import type { CellPatch, FromWorker, ToWorker } from './protocol.js';

interface Loaded {
  token: number;
  doc: CompiledDocument;
  session: Session;
  ctx: RenderContext;
  baseline: Map<string, CellState>;
  sigfigs: number;
  /** Cell id → the edit that last changed it, for cells the page may not have yet. */
  unsent: Map<string, number>;
  seq: number;
  /** Each cell's evaluations when the load settled: the page counts those of its edits only. */
  atLoad: Map<string, number>;
}

let current: Loaded | null = null;
/** Messages are handled one after the other, each after the previous one's evaluation settled. */
let queue: Promise<void> = Promise.resolve();

const post = (m: FromWorker) => (self as unknown as { postMessage(m: FromWorker): void }).postMessage(m);

async function load(m: Extract<ToWorker, { type: 'load' }>): Promise<void> {
  current?.session.dispose();
  current = null;
  const doc = compile(m.text, { file: m.file });
  const session = startSession(doc);
  const baseline = new Map(await session.settle());
  for (const [name, value] of m.overrides) session.setInput(name, value);
  await session.settle();
  const options = { standalone: false, ...(m.archive ? { archive: m.archive } : {}) };
  const ctx = makeRenderContext(doc, session.states, session.warnings, options);
  const s = doc.meta.sigfigs;
  const loaded: Loaded = { token: m.token, doc, session, ctx, baseline, sigfigs: typeof s === 'number' ? s : 4, unsent: new Map(), seq: 0, atLoad: new Map(session.evaluations) };
  session.subscribe((id, state) => { if (state.status !== 'pending') loaded.unsent.set(id, loaded.seq); });
  current = loaded;
  post({ type: 'loaded', token: m.token });
  // The cases' verdicts as the page painted them (its own run at load, with the same trial values): each
  // check limited to cases is rendered with its verdict over them, and the checks summary with the cases.
  if (m.cases) ctx.cases = await judgeWithTrials(doc, m.cases);
}

async function edit(m: Extract<ToWorker, { type: 'set' | 'reset' }>): Promise<void> {
  const received = performance.timeOrigin + performance.now();
  const c = current;
  if (!c) return;
  for (const [id, seq] of c.unsent) if (seq <= m.accepted) c.unsent.delete(id);
  c.seq = m.seq;
  if (m.type === 'set') c.session.setInput(m.name, m.value); // the page checked the text before sending it
  else c.session.resetInput(m.name);
  await c.session.settle();
  const settled = performance.timeOrigin + performance.now();
  const cells: CellPatch[] = [];
  for (const id of c.unsent.keys()) {
    const cell = c.doc.graph.byId.get(id);
    const state = c.session.states.get(id);
    if (!cell || !state) continue;
    cells.push({ id, html: renderCellOutput(cell, state, c.ctx), change: cell.kind === 'given' ? null : compareToDocument(cell, c.baseline.get(id), state, c.sigfigs, c.ctx.units) });
  }
  const { doc, ctx, session } = c;
  const parts: Array<[string, string]> = [
    ['status', renderStatus(doc, session.states, session.warnings)],
    ['check-summary', renderCheckSummary(doc, session.states, ctx)],
    ['diagnostics', renderDiagnostics(doc, session.states, session.warnings)],
  ];
  const evaluations = [...session.evaluations].flatMap(([id, n]): Array<[string, number]> => (n > (c.atLoad.get(id) ?? 0) ? [[id, n - (c.atLoad.get(id) ?? 0)]] : []));
  post({ type: 'result', seq: m.seq, token: c.token, cells, parts, evaluations, times: [received, settled, performance.timeOrigin + performance.now()] });
}

async function cases(m: Extract<ToWorker, { type: 'cases' }>): Promise<void> {
  const c = current;
  if (!c) return;
  const run = await judgeWithTrials(c.doc, m.trials);
  c.ctx.cases = run;
  const blocks: Array<[number, string]> = [];
  for (const block of c.doc.blocks) {
    if (block.kind === 'calc' && block.cellKind === 'cases') blocks.push([block.span.start.line, renderCasesBlock(block, c.ctx)]);
  }
  // A check limited to cases shows its verdict over them: its output changes with the cases' verdicts.
  const cells = checksShownByCases(c.doc).map((cell): [string, string] => [cell.id, renderCellOutput(cell, c.session.states.get(cell.id)!, c.ctx)]);
  const notes = c.doc.graph.cells.filter((cell) => cell.kind === 'check').map((cell): [string, string] => [cell.id, checkCasesNote(cell, c.ctx)]);
  post({
    type: 'cases', generation: m.generation, token: c.token, blocks, summary: renderCheckSummary(c.doc, c.session.states, c.ctx),
    cells, verdicts: [...verdictsOverCases(c.doc, run)], notes,
  });
}

/** What drives a check: its own document and sessions, so it runs beside the edits rather than before them. */
async function drivers(m: Extract<ToWorker, { type: 'drivers' }>): Promise<void> {
  const e = await explainDocument(m.text, { file: m.file, overrides: m.overrides, targets: [m.target] });
  const check = e.checks[0];
  post({ type: 'drivers', generation: m.generation, html: check ? renderDriversAppendix([check]) : null });
}

self.addEventListener('message', (e: MessageEvent<ToWorker>) => {
  const m = e.data;
  if (m.type === 'drivers') {
    drivers(m).catch((err: Error) => post({ type: 'failed', message: err.message }));
    return;
  }
  queue = queue.then(() => (m.type === 'load' ? load(m) : m.type === 'cases' ? cases(m) : edit(m))).catch((err: Error) => {
    post({ type: 'failed', message: err.message });
  });
});

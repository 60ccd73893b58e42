/**
 * Cases on the live page: a chooser of the case shown (its inputs become trial values, so the
 * review panel lists them and every result shows its move), and the envelope — each check's
 * governing case and the cases block — recomputed in the background after each change.
 */
import { compile, expandCases, judgeCases, startSession } from '../engine/index.js';
import type { Case, CaseRun, Cell, CompiledDocument } from '../engine/index.js';
import type { LiveSheet, LoadCases } from './preview.js';
import type { CheckVerdict } from './review.js';
import { verdictOverCases } from './sheet.js';

/** Waits this long after the page settles before judging every case again (ms). */
const QUIET_MS = 250;

/**
 * Judges every case of a document with the page's trial values applied on top (as `--set` does).
 * @example const run = await judgeWithTrials(sheet.doc, {L: '7 m'})
 */
export async function judgeWithTrials(doc: CompiledDocument, trials: Record<string, string>): Promise<CaseRun> {
  const d = compile(doc.source, { file: doc.file, overrides: trials });
  const session = startSession(d);
  try {
    const base = new Map(await session.settle());
    return await judgeCases(d, session, base);
  } finally {
    session.dispose();
  }
}

/**
 * The checks limited to cases (`[in …]`): on the page each shows its verdict over those cases
 * (the page's runs show no case in place of the document), so their output and their change of
 * state follow the cases' verdicts, not the page's session.
 */
export function checksShownByCases(doc: CompiledDocument): Cell[] {
  return doc.graph.cells.filter((c) => c.kind === 'check' && doc.cases.limits.has(c.id));
}

/** Each check limited to cases: its verdict over them in a run, by id. */
export function verdictsOverCases(doc: CompiledDocument, run: CaseRun): Map<string, CheckVerdict> {
  return new Map(checksShownByCases(doc).map((c) => [c.id, verdictOverCases(run, c.id)]));
}

export class LiveCases {
  private cases: Case[] = [];
  private chosen: Case | null = null;
  private generation = 0;
  private timer: ReturnType<typeof setTimeout> | undefined;
  /** The document judgeLoading judged last. */
  private judged: CompiledDocument | null = null;

  /**
   * @param select the chooser in the page's bar (hidden when the document has no cases)
   * @param changed called after the chosen case changed the trial values
   */
  constructor(private readonly sheet: LiveSheet, private readonly select: HTMLSelectElement, private readonly changed: () => void) {
    select.addEventListener('change', () => this.choose(select.value));
  }

  /** The case shown, or null for the document as written. */
  get shown(): string | null {
    return this.chosen?.name ?? null;
  }

  /**
   * The verdicts of every case for a document being loaded, with the page's trial values (LiveSheet.load paints
   * the sheet with them, so the cases block and the checks summary have their height from the start), and
   * as written (what a check limited to cases is reviewed against); undefined for a document without cases.
   */
  async judgeLoading(doc: CompiledDocument): Promise<LoadCases | undefined> {
    if (expandCases(doc, this.sheet.baseline).cases.length === 0 && doc.cases.limits.size === 0) return undefined;
    const trials = this.trials();
    const run = await judgeWithTrials(doc, trials);
    // Trial values kept over a reload: the document as written is judged apart.
    const asWritten = Object.keys(trials).length ? await judgeWithTrials(doc, {}) : run;
    this.judged = doc;
    return { run, asWritten, trials };
  }

  /** The page's trial values less the chosen case's own (every case sets those itself). */
  private trials(): Record<string, string> {
    return Object.fromEntries([...this.sheet.overrides].filter(([k, v]) => this.chosen?.overrides[k] !== v));
  }

  /** After a document (re)load: its cases in the chooser, the case asked for shown, the envelope judged. */
  loaded(initial?: string): void {
    this.cases = expandCases(this.sheet.doc, this.sheet.baseline).cases;
    const keep = this.chosen && this.cases.find((c) => c.name === this.chosen!.name);
    this.chosen = keep ?? null;
    const label = this.select.closest<HTMLElement>('label') ?? this.select;
    label.hidden = this.cases.length === 0;
    this.select.replaceChildren(...[null, ...this.cases].map((c) => {
      const o = document.createElement('option');
      o.value = c?.name ?? '';
      o.textContent = c ? `${c.name}${c.description ? ` — ${c.description}` : ''}` : 'as written';
      return o;
    }));
    this.select.value = this.chosen?.name ?? '';
    const choosing = initial !== undefined && !this.chosen;
    if (choosing) this.choose(initial);
    // Judged while loading (judgeLoading) with the same trial values: no second run, but the page
    // still says the cases are judged, as after every run.
    if (choosing || this.judged !== this.sheet.doc) this.refresh();
    else document.dispatchEvent(new CustomEvent('vaultbook:cases', { detail: { shown: this.shown } }));
  }

  /** Shows a case: the previous case's inputs go back, this one's become trial values. */
  choose(name: string): void {
    for (const input of Object.keys(this.chosen?.overrides ?? {})) this.sheet.resetInput(input);
    this.chosen = this.cases.find((c) => c.name === name) ?? null;
    for (const [input, text] of Object.entries(this.chosen?.overrides ?? {})) this.sheet.setInput(input, text);
    this.select.value = this.chosen?.name ?? '';
    this.changed();
  }

  /** Judges every case again once the page is quiet; a newer change drops an older result. */
  refresh(): void {
    clearTimeout(this.timer);
    if (this.cases.length === 0 && this.sheet.doc.cases.limits.size === 0) return;
    const generation = ++this.generation;
    // Until the verdicts are shown, what shows them is out of date (a printout says so).
    this.sheet.judgingCases(true);
    this.timer = setTimeout(async () => {
      // Evaluating in a worker: the worker judges the cases and renders their verdicts.
      let shown = this.sheet.worker ? await this.sheet.judgeCasesInWorker(this.trials(), generation) : false;
      // On the main thread, also when the worker failed before answering (the page evaluates there since).
      if (!shown && !this.sheet.worker && generation === this.generation) {
        const run = await judgeWithTrials(this.sheet.doc, this.trials());
        if (generation !== this.generation) return;
        shown = await this.sheet.showCases(run);
      }
      if (!shown || generation !== this.generation) return;
      document.dispatchEvent(new CustomEvent('vaultbook:cases', { detail: { shown: this.shown } }));
    }, QUIET_MS);
  }
}

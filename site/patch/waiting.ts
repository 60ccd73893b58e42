/**
 * What the live page marks as not up to date: in worker mode the cells waiting for an edit's new
 * values (WAITING_CLASS and aria-busy, on screen), and for a printout (print.css) the parts out of
 * date meanwhile: the checks summary while an edit's answer is awaited, the cases blocks and checks
 * limited to cases while the cases are judged again (STALE_CLASS), and the body while anything is
 * pending (PENDING_CLASS, a banner).
 */
import { checksShownByCases } from '../cases.js';
import type { CompiledDocument } from '../../engine/index.js';
import type { SheetElements } from './elements.js';

/** The class (with aria-busy) of a cell whose new value is being computed. */
export const WAITING_CLASS = 'lv-computing';

/**
 * The class of a part whose values are out of date until the cases are judged again (each check
 * limited to cases, each cases block), or until an edit's answer arrives (the checks summary). Only
 * a printout shows it (print.css), with the body's PENDING_CLASS banner: the screen has the waiting marks.
 */
export const STALE_CLASS = 'lv-stale';

/** The body's class while any value on the page is pending (print.css prints a banner then). */
export const PENDING_CLASS = 'lv-pending';

export class WaitingMarks {
  /** Worker mode: cells marked waiting for their new values. */
  private readonly waiting = new Set<string>();
  /** The cases are being judged again: what shows their verdicts is out of date. */
  private casesStale = false;

  constructor(private readonly root: HTMLElement, private readonly elements: SheetElements, private readonly doc: () => CompiledDocument | undefined) {}

  get size(): number {
    return this.waiting.size;
  }

  has(id: string): boolean {
    return this.waiting.has(id);
  }

  /** The cells waiting, in the order they were added. */
  ids(): string[] {
    return [...this.waiting];
  }

  /** A new sheet: nothing waits, the cases' verdicts shown are its own. */
  clear(): void {
    this.waiting.clear();
    this.casesStale = false;
  }

  /** Cells an edit may move: waiting from now on (marked on the page by `mark`). */
  add(ids: string[]): void {
    for (const id of ids) this.waiting.add(id);
  }

  /** Marks the cells still waiting for their new values among `ids` (class and aria-busy). */
  mark(ids: string[]): void {
    let marked = false;
    for (const id of ids) {
      const el = this.waiting.has(id) ? this.elements.cells.get(id) : undefined;
      if (!el) continue;
      el.classList.add(WAITING_CLASS);
      el.setAttribute('aria-busy', 'true');
      marked = true;
    }
    if (marked) this.showPending();
  }

  /** A cell's new value arrived (or none is coming): no longer marked waiting. */
  unmark(id: string): void {
    if (!this.waiting.delete(id)) return;
    const el = this.elements.cells.get(id);
    el?.classList.remove(WAITING_CLASS);
    el?.removeAttribute('aria-busy');
    if (this.waiting.size === 0) this.showPending();
  }

  /** The cases are being judged again (on), or not any more (off). */
  judgingCases(on: boolean): void {
    if (this.casesStale === on) return;
    this.casesStale = on;
    this.showPending();
  }

  /** The cases' verdicts just shown are the latest. */
  casesShown(): void {
    this.casesStale = false;
    this.showPending();
  }

  /**
   * Marks what is out of date, for a printout (print.css): the parts that show the cases' verdicts
   * while they are judged again, the checks summary while an edit's answer is awaited too, and the
   * body (a banner) while anything is pending.
   */
  showPending(): void {
    const { cells, parts } = this.elements;
    const waiting = this.waiting.size > 0 && [...this.waiting].some((id) => cells.get(id)?.classList.contains(WAITING_CLASS));
    document.body.classList.toggle(PENDING_CLASS, waiting || this.casesStale);
    parts.get('check-summary')?.classList.toggle(STALE_CLASS, waiting || this.casesStale);
    for (const el of this.root.querySelectorAll<HTMLElement>('[data-cases]')) el.classList.toggle(STALE_CLASS, this.casesStale);
    const doc = this.doc();
    if (doc) for (const cell of checksShownByCases(doc)) cells.get(cell.id)?.classList.toggle(STALE_CLASS, this.casesStale);
  }
}

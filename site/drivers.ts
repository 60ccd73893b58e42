/**
 * What drives a check, on the live page: clicking a check marks the cells on its dependency path
 * and shows its inputs ranked by swing (the sheet appendix's table for that one check), computed in
 * the background (in the page's evaluation worker, when it has one) with the page's trial values; a
 * change of input computes them again. Clicking the check again (or Escape) clears it.
 */
import { explainDocument } from '../engine/drivers/index.js';
import { upstreamOf } from '../engine/drivers/prune.js';
import { renderDriversAppendix } from '../engine/render/drivers.js';
import type { LiveSheet } from './preview.js';

const STYLE = '.lv-path { outline: 1.5px solid #2c4a6b; outline-offset: 1px; background: #eef3f8; }'
  + ' .lv-drivers { margin: 2mm 0 3mm; padding: 2mm 3mm; border-left: 3px solid #2c4a6b; background: #f7f9fb; font-size: 9pt; }'
  + ' .lv-drivers h2 { display: none; } .lv-drivers > p:first-child { margin: 0; color: #5b6773; }';

export class LiveDrivers {
  private selected: string | null = null;
  private box: HTMLElement | null = null;
  /** Bumped by every request; an older result is dropped. */
  private generation = 0;

  constructor(private readonly sheet: LiveSheet, private readonly text: () => string) {
    const style = document.createElement('style');
    style.textContent = STYLE;
    document.head.append(style);
    sheet.root.addEventListener('click', (e) => {
      const target = e.target as HTMLElement;
      if (target.closest('input, a, .lv-drivers')) return;
      const el = target.closest<HTMLElement>('[data-cell]');
      const id = el?.dataset.cell;
      if (!id || this.sheet.cell(id)?.kind !== 'check') return;
      this.select(id === this.selected ? null : id);
    });
    document.addEventListener('keydown', (e) => { if (e.key === 'Escape' && this.selected) this.select(null); });
    document.addEventListener('vaultbook:settled', () => { if (this.selected) void this.refresh(); });
    document.addEventListener('vaultbook:loaded', () => { if (this.selected) this.select(this.sheet.cell(this.selected) ? this.selected : null); });
  }

  /** Selects a check (null clears): marks its path and computes its drivers. */
  select(id: string | null): void {
    for (const el of this.sheet.root.querySelectorAll('.lv-path')) el.classList.remove('lv-path');
    this.box?.remove();
    this.box = null;
    this.selected = id;
    this.generation++;
    if (id === null) return;
    for (const cell of upstreamOf(this.sheet.doc.graph, [id])) this.sheet.cellElement(cell)?.classList.add('lv-path');
    const anchor = this.sheet.cellElement(id);
    if (!anchor) return;
    this.box = document.createElement('div');
    this.box.className = 'lv-drivers';
    this.box.setAttribute('aria-live', 'polite');
    this.box.innerHTML = '<p>working out what drives this check…</p>';
    anchor.after(this.box);
    void this.refresh();
  }

  private async refresh(): Promise<void> {
    const id = this.selected;
    if (!id) return;
    const generation = ++this.generation;
    // Worked out in the page's evaluation worker when there is one (it perturbs every input upstream:
    // too long for the main thread); undefined: the worker failed meanwhile, so here after all.
    let html = this.sheet.worker ? await this.sheet.driversInWorker(this.text(), id) : undefined;
    if (generation !== this.generation || !this.box) return;
    if (html === undefined) {
      const e = await explainDocument(this.text(), { file: this.sheet.doc.file, overrides: Object.fromEntries(this.sheet.overrides), targets: [id] });
      if (generation !== this.generation || !this.box) return;
      const check = e.checks[0];
      html = check ? renderDriversAppendix([check]) : null;
    }
    this.box.innerHTML = html ?? '<p>This check could not be explained.</p>';
    this.box.dataset.check = id;
  }
}

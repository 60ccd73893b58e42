/**
 * The live sheet's elements that patches replace: each cell's output (`data-cell`), each part that
 * depends on every cell (`data-part`: status banner, checks summary, diagnostics list), and the HTML
 * each shows as it was rendered (not as the DOM serialises it), so that a patch replaces only what
 * differs. LiveSheet (site/preview.ts) indexes them once per document text.
 */

/**
 * Replaces an element's content with parsed HTML. Parsing into a detached
 * fragment first is cheaper than innerHTML on a styled, attached element.
 */
function replaceInner(el: HTMLElement, html: string): void {
  const range = document.createRange();
  range.selectNodeContents(el);
  el.replaceChildren(range.createContextualFragment(html));
}

export class SheetElements {
  readonly cells = new Map<string, HTMLElement>();
  readonly parts = new Map<string, HTMLElement>();
  /**
   * The HTML each element shows, as rendered: cell ids; `@part` for the summary parts; `~note-ID` for
   * a check's cases note; `#cases-LINE` for a cases block.
   */
  readonly lastHtml = new Map<string, string>();

  /** Finds the elements of a sheet just painted; forgets the HTML of the last. */
  index(root: HTMLElement): void {
    this.cells.clear();
    this.parts.clear();
    this.lastHtml.clear();
    for (const el of root.querySelectorAll<HTMLElement>('[data-cell]')) this.cells.set(el.dataset.cell!, el);
    for (const el of root.querySelectorAll<HTMLElement>('[data-part]')) this.parts.set(el.dataset.part!, el);
  }

  /** Shows `html` in a cell's element unless it shows it already; true when the element was replaced. */
  replaceCell(el: HTMLElement, id: string, html: string): boolean {
    if (html === this.lastHtml.get(id)) return false;
    replaceInner(el, html);
    this.lastHtml.set(id, html);
    return true;
  }

  /** Renders a summary part; true when its element was replaced. */
  patchPart(part: string, render: () => string): boolean {
    const el = this.parts.get(part);
    if (!el) return false;
    const html = render();
    if (html === this.lastHtml.get(`@${part}`)) return false;
    replaceInner(el, html);
    this.lastHtml.set(`@${part}`, html);
    return true;
  }

  /** A check's cases note (its governing case), above its output; '' removes it. */
  patchNote(id: string, html: string): void {
    const key = `~note-${id}`;
    const out = this.cells.get(id);
    if (this.lastHtml.get(key) === html || !out?.parentElement) return;
    out.parentElement.querySelector(':scope > .vb-casenote')?.remove();
    if (html) out.insertAdjacentHTML('beforebegin', html);
    this.lastHtml.set(key, html);
  }
}

/**
 * Measures of a printed or shown sheet, shared by the layout tests and the bench:
 * what overflows its box, the font sizes a PDF holds, the size of figure text on paper.
 */
import { execFileSync } from 'node:child_process';
import type { Page } from 'playwright-core';

/**
 * Elements of the sheet that stick out of their box: out of the working or output column they sit
 * in, or out of the sheet itself; and boxes that scroll (which would clip on paper).
 * @returns one line per element, '' entries never
 */
export function overflowsIn(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    const columns = '.vb-work, .vb-out, .vb-sheet, .vb-figbody, .vb-prose';
    for (const el of document.querySelectorAll<HTMLElement>('.vb-sheet *')) {
      if (el.closest('.katex-mathml')) continue;
      const box = (el.matches(columns) ? el.parentElement!.closest(columns) : el.closest(columns)) as HTMLElement | null;
      if (!box) continue;
      const r = el.getBoundingClientRect();
      const b = box.getBoundingClientRect();
      // An SVG element's className is an object: its class attribute names it (an SVG text with its words).
      const what = `${el.tagName.toLowerCase()}.${(el.getAttribute('class') ?? '').split(' ')[0]}${el instanceof SVGElement ? ` "${el.textContent}"` : ''} in .${box.className.split(' ')[0]}`;
      if (r.width > 0 && (r.right > b.right + 1 || r.left < b.left - 1)) out.push(`${what} by ${Math.round(Math.max(r.right - b.right, b.left - r.left))} px`);
      if (getComputedStyle(el).overflowX !== 'visible' && el.scrollWidth > el.clientWidth + 1) out.push(`${what} scrolls: ${el.scrollWidth} > ${el.clientWidth} px`);
    }
    return [...new Set(out)];
  });
}

/** Font sizes in a PDF, page by page: pt → number of characters set in that size. */
export function pdfFontSizes(pdfFile: string): Array<Map<number, number>> {
  // pdftohtml draws at 1.5 px per pt and names each font with its size.
  const xml = execFileSync('pdftohtml', ['-xml', '-stdout', '-i', '-q', pdfFile], { encoding: 'utf8', maxBuffer: 64 << 20 });
  const sizes = new Map<string, number>();
  for (const m of xml.matchAll(/<fontspec id="(\d+)" size="(-?[\d.]+)"/g)) sizes.set(m[1]!, Number(m[2]) / 1.5);
  return xml.split('<page ').slice(1).map((page) => {
    const count = new Map<number, number>();
    for (const m of page.matchAll(/<text [^>]*font="(\d+)"[^>]*>(.*?)<\/text>/g)) {
      const size = Math.round(sizes.get(m[1]!)! * 10) / 10;
      const chars = m[2]!.replace(/<[^>]+>/g, '').trim().length;
      if (chars) count.set(size, (count.get(size) ?? 0) + chars);
    }
    return count;
  });
}

/**
 * The size that the largest fifth of a page's characters reach: the size of its running text, whatever
 * share of the page small print (tables, figure labels) takes. A page shrunk to fit falls below 8.5 pt.
 */
export function textSize(sizes: Map<number, number>): number {
  const sorted = [...sizes].sort((a, b) => a[0] - b[0]);
  const total = sorted.reduce((n, [, c]) => n + c, 0);
  let seen = 0;
  for (const [size, n] of sorted) {
    seen += n;
    if (seen >= 0.8 * total) return size;
  }
  return 0;
}

/**
 * The size of each text of each figure as it prints, in pt: the font size scaled as the SVG is scaled
 * (call with print media emulated and the page as wide as the paper's text column).
 */
export function figureTextSizes(page: Page): Promise<Array<{ text: string; pt: number }>> {
  return page.evaluate(() => [...document.querySelectorAll<SVGTextElement>('.vb-svg svg text')].map((t) => {
    const svg = t.ownerSVGElement!;
    const scale = svg.getBoundingClientRect().width / (svg.viewBox.baseVal?.width || svg.getBoundingClientRect().width);
    const px = parseFloat(getComputedStyle(t).fontSize) * scale;
    return { text: t.textContent ?? '', pt: Math.round(px * 0.75 * 10) / 10 };
  }));
}

/** The numbers a sheet's working shows (from its MathML), for finding them again in the PDF's text. */
export function workingNumbers(page: Page): Promise<string[]> {
  return page.evaluate(() => [...new Set([...document.querySelectorAll('.vb-rows .katex-mathml mn')].map((n) => n.textContent ?? '').filter((t) => /\d/.test(t)))]);
}

/**
 * Texts of figures (labels the placement pass moved, headings, facts, legends, ticks) that a line, a path or
 * another text crosses, measured on the glyphs Chromium draws, each pair of texts once; and texts that stick
 * out of their drawing.
 */
export function figureClashes(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    const INSET = 0.25; // mm: a line touching a label's outermost pixel is not crossing it
    for (const [f, svg] of [...document.querySelectorAll<SVGSVGElement>('.vb-svg svg')].entries()) {
      const root = svg.getCTM()!;
      const texts = [...svg.querySelectorAll<SVGTextElement>('text')];
      const boxOf = (t: SVGTextElement) => {
        const b = t.getBBox();
        return { x0: b.x + INSET, y0: b.y + INSET, x1: b.x + b.width - INSET, y1: b.y + b.height - INSET };
      };
      // Points of every line and path, in the svg's own units.
      const polylines: DOMPoint[][] = [];
      // A panel's pale grid (class vb-grid) lies under everything and may pass behind a label; every other line may not.
      for (const l of svg.querySelectorAll<SVGLineElement>('line')) {
        if (l.closest('.vb-grid')) continue;
        const [x1, y1, x2, y2] = [l.x1.baseVal.value, l.y1.baseVal.value, l.x2.baseVal.value, l.y2.baseVal.value];
        const steps = Math.max(1, Math.ceil(Math.hypot(x2 - x1, y2 - y1) / 0.3));
        polylines.push(Array.from({ length: steps + 1 }, (_, i) => new DOMPoint(x1 + ((x2 - x1) * i) / steps, y1 + ((y2 - y1) * i) / steps)));
      }
      for (const p of svg.querySelectorAll<SVGPathElement>('path')) {
        const n = p.getTotalLength();
        const pts: DOMPoint[] = [];
        for (let s = 0; s <= n; s += 0.3) { const q = p.getPointAtLength(s); pts.push(new DOMPoint(q.x, q.y)); }
        polylines.push(pts);
      }
      const vb = svg.viewBox.baseVal;
      for (const t of texts) {
        const b = t.getBBox();
        const m = root.inverse().multiply(t.getCTM()!);
        const corners = [[b.x, b.y], [b.x + b.width, b.y], [b.x, b.y + b.height], [b.x + b.width, b.y + b.height]].map(([x, y]) => new DOMPoint(x, y).matrixTransform(m));
        if (corners.some((c) => c.x < vb.x - 0.5 || c.y < vb.y - 0.5 || c.x > vb.x + vb.width + 0.5 || c.y > vb.y + vb.height + 0.5)) out.push(`figure ${f + 1}: "${t.textContent}" runs out of the drawing`);
        const box = boxOf(t);
        const toText = m.inverse();
        const inBox = (p: DOMPoint) => { const q = p.matrixTransform(toText); return q.x > box.x0 && q.x < box.x1 && q.y > box.y0 && q.y < box.y1; };
        if (polylines.some((pl) => pl.some(inBox))) out.push(`figure ${f + 1}: a line crosses "${t.textContent}"`);
        for (const o of texts) {
          if (o === t) continue;
          const ob = o.getBBox();
          const om = root.inverse().multiply(o.getCTM()!);
          const oc = [[ob.x + INSET, ob.y + INSET], [ob.x + ob.width - INSET, ob.y + INSET], [ob.x + INSET, ob.y + ob.height - INSET], [ob.x + ob.width - INSET, ob.y + ob.height - INSET], [ob.x + ob.width / 2, ob.y + ob.height / 2]]
            .map(([x, y]) => new DOMPoint(x, y).matrixTransform(om));
          if (oc.some(inBox) && !out.includes(`figure ${f + 1}: "${t.textContent}" overlaps "${o.textContent}"`)) out.push(`figure ${f + 1}: "${o.textContent}" overlaps "${t.textContent}"`);
        }
      }
    }
    return [...new Set(out)];
  });
}

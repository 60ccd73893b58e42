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
      const what = `${el.tagName.toLowerCase()}.${String(el.className).split(' ')[0]} in .${box.className.split(' ')[0]}`;
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

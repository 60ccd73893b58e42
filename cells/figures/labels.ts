/**
 * Label placement: a pass over a finished drawing that moves each movable label
 * to the first of its candidate positions where no line and no other text
 * crosses it. Labels are marked by marks.ts's `label()` (`data-place`); lines,
 * paths (straight segments), rectangles and the other texts are the obstacles.
 * Text extents are estimated from the font size (Liberation Sans: about 0.55 em
 * per character, common practice for sans-serif text widths), so the pass runs
 * in the kernel as well as in the browser, without measuring glyphs.
 */
import { num, TEXT_SIZE, type P } from './svg.js';

interface Seg { a: P; b: P }

/** A text's box: centre, unit direction of its baseline, half width and half height (mm). */
interface Box { c: P; u: P; hw: number; hh: number }

const ATTR = (tag: string, name: string) => new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1];
const N = (tag: string, name: string) => Number(ATTR(tag, name) ?? 0);

/** Width of a text in mm, estimated. */
function textWidth(content: string, size: number): number {
  return [...content].length * size * 0.55;
}

/** The straight segments of a path's data (M, L, H, V, Z in either case); curves are left out. */
function pathSegments(d: string): Seg[] {
  const out: Seg[] = [];
  const tokens = d.match(/[MLHVZmlhvz]|-?\d*\.?\d+(?:e-?\d+)?/g) ?? [];
  let cmd = 'M', cur: P = { x: 0, y: 0 }, start: P = cur;
  const nums: number[] = [];
  const flush = () => {
    while (nums.length) {
      const rel = cmd === cmd.toLowerCase();
      const C = cmd.toUpperCase();
      let next: P;
      if (C === 'H') next = { x: (rel ? cur.x : 0) + nums.shift()!, y: cur.y };
      else if (C === 'V') next = { x: cur.x, y: (rel ? cur.y : 0) + nums.shift()! };
      else if (nums.length >= 2) next = { x: (rel ? cur.x : 0) + nums.shift()!, y: (rel ? cur.y : 0) + nums.shift()! };
      else { nums.length = 0; return; }
      if (C === 'M') { start = next; cmd = rel ? 'l' : 'L'; } else out.push({ a: cur, b: next });
      cur = next;
    }
  };
  for (const t of tokens) {
    if (/[A-Za-z]/.test(t)) {
      flush();
      cmd = t;
      if (t === 'Z' || t === 'z') { out.push({ a: cur, b: start }); cur = start; }
    } else nums.push(Number(t));
  }
  flush();
  return out;
}

function rotateAbout(p: P, c: P, cos: number, sin: number): P {
  const dx = p.x - c.x, dy = p.y - c.y;
  return { x: c.x + dx * cos - dy * sin, y: c.y + dx * sin + dy * cos };
}

/** Does the segment cross the box (or lie in it)? Tested in the box's own frame (Liang–Barsky clipping). */
function crosses(s: Seg, box: Box): boolean {
  const local = (p: P) => {
    const dx = p.x - box.c.x, dy = p.y - box.c.y;
    return { x: dx * box.u.x + dy * box.u.y, y: -dx * box.u.y + dy * box.u.x };
  };
  const a = local(s.a), b = local(s.b);
  let t0 = 0, t1 = 1;
  const dx = b.x - a.x, dy = b.y - a.y;
  for (const [p, q] of [[-dx, a.x + box.hw], [dx, box.hw - a.x], [-dy, a.y + box.hh], [dy, box.hh - a.y]] as const) {
    if (Math.abs(p) < 1e-12) { if (q < 0) return false; continue; }
    const r = q / p;
    if (p < 0) { if (r > t1) return false; if (r > t0) t0 = r; } else { if (r < t0) return false; if (r < t1) t1 = r; }
  }
  return true;
}

function edges(box: Box): Seg[] {
  const { c, u, hw, hh } = box;
  const corner = (sx: number, sy: number): P => ({ x: c.x + u.x * hw * sx - u.y * hh * sy, y: c.y + u.y * hw * sx + u.x * hh * sy });
  const k = [corner(-1, -1), corner(1, -1), corner(1, 1), corner(-1, 1)];
  return k.map((p, i) => ({ a: p, b: k[(i + 1) % 4]! }));
}

function overlaps(a: Box, b: Box): boolean {
  return edges(a).some((e) => crosses(e, b)) || crosses({ a: a.c, b: a.c }, b) || crosses({ a: b.c, b: b.c }, a);
}

interface Text { tag: string; content: string; start: number; end: number; box: Box; place: string | null; angle: number; anchor: P }

/** The box of a text element as written (x, y, anchor, baseline, rotation). */
function textBox(tag: string, content: string, inherited: number): { box: Box; angle: number; anchor: P } {
  const size = Number(ATTR(tag, 'font-size') ?? inherited);
  const w = textWidth(content.replace(/&[a-z#0-9]+;/g, '&'), size);
  const x = N(tag, 'x'), y = N(tag, 'y');
  const anchor = ATTR(tag, 'text-anchor') ?? 'start';
  const m = /rotate\(([-\d.]+)/.exec(ATTR(tag, 'transform') ?? '');
  const angle = m ? Number(m[1]) : 0;
  const rad = (angle * Math.PI) / 180;
  const u = { x: Math.cos(rad), y: Math.sin(rad) };
  const along = anchor === 'middle' ? 0 : anchor === 'end' ? -w / 2 : w / 2;
  // Baseline y: the glyphs sit from 0.75 em above it to 0.2 em below; a central baseline centres them.
  const down = ATTR(tag, 'dominant-baseline') === 'central' ? 0 : -0.28 * size;
  const c = { x: x + u.x * along - u.y * down, y: y + u.y * along + u.x * down };
  return { box: { c, u, hw: w / 2 + 0.3, hh: 0.5 * size + 0.15 }, angle, anchor: { x, y } };
}

/** Candidate shifts for a label: in place first, then nearby, nearest first. */
function candidates(t: Text): P[] {
  const { hw, hh, u } = t.box;
  const out: P[] = [{ x: 0, y: 0 }];
  if (t.place === 'along') {
    // A dimension's label first steps a little off its line (clear of the arrowheads of a dimension hardly
    // longer than its label), then slides along it.
    for (const d of [0.6, 1.2]) for (const s of [1, -1]) out.push({ x: -u.y * d * s, y: u.x * d * s });
    for (const f of [0.6, 1.2, 1.8, 2.4, 3]) for (const s of [1, -1]) out.push({ x: u.x * hw * f * s, y: u.y * hw * f * s });
    return out;
  }
  for (const r of [1, 2, 3]) {
    for (const [dx, dy] of [[0, -1], [0, 1], [1, 0], [-1, 0], [1, -1], [-1, -1], [1, 1], [-1, 1]] as const) {
      out.push({ x: dx * r * (hw + 0.8), y: dy * r * (hh * 2 + 0.4) });
    }
  }
  return out;
}

/**
 * Moves each movable label of an SVG body to a place where nothing crosses it.
 * @param body the drawing's markup (inside <svg>), as built by svg.ts and marks.ts
 * @param width, height the paper size (mm): labels stay inside it
 * @returns the markup with the labels moved and their marks removed
 */
export function placeLabels(body: string, width: number, height: number): string {
  const segs: Seg[] = [];
  // A panel's grid (axes.ts) lies under everything: a label goes over a grid line rather than over the drawing.
  const grids = [...body.matchAll(/<g class="vb-grid"[^>]*>.*?<\/g>/gs)].map((g) => ({ from: g.index!, to: g.index! + g[0].length }));
  const grid: Seg[] = [];
  for (const m of body.matchAll(/<line [^>]*\/>/g)) {
    (grids.some((g) => m.index! > g.from && m.index! < g.to) ? grid : segs).push({ a: { x: N(m[0], 'x1'), y: N(m[0], 'y1') }, b: { x: N(m[0], 'x2'), y: N(m[0], 'y2') } });
  }
  for (const m of body.matchAll(/<path [^>]*\/>/g)) segs.push(...pathSegments(ATTR(m[0], 'd') ?? ''));
  for (const m of body.matchAll(/<rect [^>]*\/>/g)) {
    const x = N(m[0], 'x'), y = N(m[0], 'y'), w = N(m[0], 'width'), h = N(m[0], 'height');
    segs.push(...edges({ c: { x: x + w / 2, y: y + h / 2 }, u: { x: 1, y: 0 }, hw: w / 2, hh: h / 2 }));
  }
  // Texts in a group with a font size (tick labels) inherit it.
  const texts: Text[] = [];
  const groupSize = [...body.matchAll(/<g [^>]*font-size="([\d.]+)"[^>]*>(.*?)<\/g>/gs)].map((g) => ({ from: g.index!, to: g.index! + g[0].length, size: Number(g[1]) }));
  for (const m of body.matchAll(/<text ([^>]*)>([^<]*)<\/text>/g)) {
    const tag = `<text ${m[1]}>`;
    const inherited = groupSize.find((g) => m.index! > g.from && m.index! < g.to)?.size ?? TEXT_SIZE;
    const { box, angle, anchor } = textBox(tag, m[2]!, inherited);
    texts.push({ tag, content: m[2]!, start: m.index!, end: m.index! + m[0].length, box, place: ATTR(tag, 'data-place') ?? null, angle, anchor });
  }
  const fixed = texts.filter((t) => !t.place).map((t) => t.box);
  const placed: Box[] = [];
  const inside = (b: Box) => edges(b).every((e) => e.a.x >= 0 && e.a.x <= width && e.a.y >= 0 && e.a.y <= height);
  const clash = (b: Box) => segs.filter((s) => crosses(s, b)).length + [...fixed, ...placed].filter((o) => overlaps(b, o)).length
    + 0.01 * grid.filter((s) => crosses(s, b)).length;
  let out = '';
  let at = 0;
  for (const t of texts) {
    if (!t.place) continue;
    let best = { shift: { x: 0, y: 0 }, box: t.box, score: Infinity };
    for (const shift of candidates(t)) {
      const box = { ...t.box, c: { x: t.box.c.x + shift.x, y: t.box.c.y + shift.y } };
      const score = clash(box) + (inside(box) ? 0 : 1000);
      if (score < best.score) best = { shift, box, score };
      if (score === 0) break;
    }
    placed.push(best.box);
    const x = t.anchor.x + best.shift.x, y = t.anchor.y + best.shift.y;
    let tag = t.tag.replace(/\sdata-place="[^"]*"/, ' class="vb-label"').replace(/\sx="[^"]*"/, ` x="${num(x)}"`).replace(/\sy="[^"]*"/, ` y="${num(y)}"`);
    if (t.angle) tag = tag.replace(/rotate\([^)]*\)/, `rotate(${num(t.angle)} ${num(x)} ${num(y)})`);
    out += body.slice(at, t.start) + tag + t.content + '</text>';
    at = t.end;
  }
  return out + body.slice(at);
}

/**
 * Breaks a text into lines no wider than `maxWidth` mm at `size` (estimated as the placement pass does).
 * @example wrapLines('least base width: 1.40 m (middle third), 0.85 m (in base)', 60) // two lines
 */
export function wrapLines(content: string, maxWidth: number, size = TEXT_SIZE): string[] {
  // A number keeps the word after it (its unit) on its line: "6.01 kN" is never split, so the sheet can still
  // read it as one quantity (engine/render/figure-units.ts) and so can the reader (common practice).
  const words: string[] = [];
  for (const w of content.split(/\s+/)) {
    if (words.length && /\d$/.test(words[words.length - 1]!) && /^[A-Za-z°µ]/.test(w)) words[words.length - 1] += ` ${w}`;
    else words.push(w);
  }
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    const next = line ? `${line} ${word}` : word;
    if (line && textWidth(next, size) > maxWidth) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

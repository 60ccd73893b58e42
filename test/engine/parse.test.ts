import { describe, it, expect } from 'vitest';
import { compile } from '../../engine/index.js';
import { fence } from '../helpers/settle.js';

describe('compile(source) — parsing and positions', () => {
  it('stamps each cell with its document line and keeps descriptions and ranges', () => {
    const doc = compile(['---', 'title: Fictional test', '---', '# Heading', '', 'Prose.', '',
      fence('given', 'L = 6.4 m   # clear span between springings [3 m, 12 m]', '', 'rise = 3.2 m # rise at the crown'),
    ].join('\n'));
    const [L, rise] = doc.graph.cells;
    expect(L!.span.start).toMatchObject({ line: 9, column: 1 });
    expect(L!.description).toBe('clear span between springings');
    expect(L!.range).toMatchObject({ lo: '3 m', hi: '12 m' });
    expect(rise!.span.start.line).toBe(11);
    expect(doc.meta).toEqual({ title: 'Fictional test' });
  });

  it('reads a multi-line expression inside brackets as one statement', () => {
    const doc = compile(fence('calc', 'a = max(', '  2,   # first', '  3', ')', 'b = a + 1'));
    expect(doc.diagnostics).toEqual([]);
    expect(doc.graph.cells.map((c) => [c.id, c.span.start.line, c.span.end.line])).toEqual([['a', 2, 5], ['b', 6, 6]]);
    expect(doc.graph.cells[0]!.description).toBe('first');
  });

  it('points a syntax error at the line and column where mathjs stopped', () => {
    const doc = compile(['Intro', '', fence('calc', 'a = 2', 'b = (a + * 3)')].join('\n'));
    const d = doc.diagnostics.find((x) => x.ruleId === 'parse/syntax')!;
    expect(d).toMatchObject({ line: 5, cellId: 'b', severity: 'error' });
    expect(d.column).toBeGreaterThan(5);
  });

  it('treats CRLF documents exactly like LF ones', () => {
    const lf = compile(fence('given', 'L = 6 m # span', 'w = 2 kN/m'));
    const crlf = compile(fence('given', 'L = 6 m # span', 'w = 2 kN/m').replace(/\n/g, '\r\n'));
    expect(crlf.graph.cells.map((c) => [c.id, c.span.start.line, c.description])).toEqual(lf.graph.cells.map((c) => [c.id, c.span.start.line, c.description]));
  });

  it('leaves ordinary code blocks alone and keeps `#` inside strings', () => {
    const doc = compile(['```js', 'x = 1', '```', fence('calc', 'label = "bay #2"  # a name')].join('\n'));
    expect(doc.graph.cells.map((c) => c.id)).toEqual(['label']);
    expect(doc.graph.cells[0]!.source).toBe('"bay #2"');
  });

  it('reports bad front matter with its line and keeps going', () => {
    const doc = compile(['---', 'title: [unclosed', '---', fence('given', 'L = 2 m')].join('\n'));
    expect(doc.diagnostics.some((d) => d.ruleId === 'parse/front-matter' && d.line >= 2)).toBe(true);
    expect(doc.graph.cells.map((c) => c.id)).toEqual(['L']);
  });

  it('keeps unknown front-matter keys', () => {
    const doc = compile(['---', 'project: Fictional Hill College', 'site_grid: C4', '---', ''].join('\n'));
    expect(doc.meta).toEqual({ project: 'Fictional Hill College', site_grid: 'C4' });
  });

  it('requires given and calc lines to define a name', () => {
    const doc = compile(fence('calc', '2 + 3'));
    expect(doc.diagnostics[0]).toMatchObject({ ruleId: 'parse/cell', line: 2 });
  });
});

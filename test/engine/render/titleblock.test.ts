import { describe, expect, it } from 'vitest';
import { readTitle, pageStyle, renderTitleBlock, metaText } from '../../../engine/render/titleblock.js';

describe('readTitle(meta)', () => {
  it('readTitle accepts the usual spellings of the title-block keys', () => {
    const t = readTitle({ 'calc reference': 'VB-1', rev: 'C', 'prepared by': 'A', checked_by: 'B', job_no: 7, Project: 'P', basis: ['EN 1996-1-1', 'EN 1990'], sigfigs: 3 });
    expect(t).toMatchObject({ calcRef: 'VB-1', revision: 'C', prepared: 'A', checked: 'B', job: '7', project: 'P', basis: ['EN 1996-1-1', 'EN 1990'], sigfigs: 3, extra: [] });
    expect(readTitle({ calc_ref: 'VB-2' }).calcRef).toBe('VB-2');
  });

  it('readTitle keeps unknown keys, in order, as text', () => {
    const t = readTitle({ title: 'T', client: 'Invented Ltd', site: { town: 'X', grid: 12 }, phases: [1, 2] });
    expect(t.extra).toEqual([['client', 'Invented Ltd'], ['site', 'town: X; grid: 12'], ['phases', '1, 2']]);
  });

  it('metaText writes dates as ISO days', () => {
    expect(metaText(new Date(Date.UTC(2026, 2, 14)))).toBe('2026-03-14');
  });

  it('renderTitleBlock escapes every front-matter value', () => {
    const html = renderTitleBlock(readTitle({ title: '<script>x</script>', client: '"><img src=x onerror=alert(1)>' }), 'f.md');
    expect(html).not.toContain('<script>');
    expect(html).not.toContain('<img');
    expect(html).toContain('&lt;script&gt;');
  });

  it('pageStyle puts the reference in the header and "sheet n of N" from the print engine in the footer', () => {
    const css = pageStyle(readTitle({ title: 'Ring', calc_ref: 'VB-7', revision: 'B', project: 'P', job: 'J1', prepared: 'A', checked: 'C', date: '2026-01-02' }), 'f.md');
    expect(css).toContain('@top-left { content: "Ring"');
    expect(css).toContain('@top-right { content: "calc VB-7  ·  rev B  ·  2026-01-02"');
    expect(css).toContain('content: "sheet " counter(page) " of " counter(pages)');
    expect(css).toContain('@bottom-left { content: "P  ·  job J1  ·  prepared A  ·  checked C"');
  });

  it('pageStyle cannot be escaped by a front-matter value', () => {
    const css = pageStyle(readTitle({ title: '"; } body { display: none } </style><script>alert(1)</script>' }), 'f.md');
    expect(css).not.toContain('</style>');
    expect(css).not.toContain('<script');
    const outsideStrings = css.replace(/"[^"]*"/g, '""');
    expect(outsideStrings.match(/\{/g)?.length).toBe(outsideStrings.match(/\}/g)?.length);
    expect(outsideStrings).not.toContain('display');
    expect(css).toContain('\\22 ; } body');
  });
});

import { describe, expect, it } from 'vitest';
import { readTitle, pageStyle, renderTitleBlock, metaText, footerText } from '../../../engine/render/titleblock.js';

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

  it('footerText keeps every name whole: in full when it fits, else without remarks in brackets and the project', () => {
    const short = readTitle({ project: 'Hartwell Hill College (fictional)', job: 'HHC-118', prepared: 'J. Marlowe (fictional)', checked: 'K. Osei (fictional)' });
    expect(footerText(short)).toBe('Hartwell Hill College (fictional)  ·  job HHC-118  ·  prepared J. Marlowe (fictional)  ·  checked K. Osei (fictional)');
    const long = readTitle({
      project: 'Hartwell Hill College, cloister north walk, bays 1 to 9 inclusive, with the undercroft below (fictional)', job: 'T-016',
      prepared: 'J. Marlowe (fictional), with A. N. Other-Longname (fictional) and the Hartwell Hill works office',
      checked: 'K. Osei-Brightwater (fictional), independent checker for the college estates department',
    });
    const text = footerText(long);
    expect(text).toBe('job T-016  ·  prepared J. Marlowe, with A. N. Other-Longname and the Hartwell Hill works office  ·  checked K. Osei-Brightwater, independent checker for the college estates department');
    expect(text).not.toContain('…');
    expect(pageStyle(long, 'f.md')).toContain('checked K. Osei-Brightwater, independent checker for the college estates department');
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

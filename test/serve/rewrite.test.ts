import { describe, it, expect } from 'vitest';
import { rewriteGivenValues, RewriteError } from '../../bin/serve/rewrite.js';
import { compile } from '../../engine/index.js';

// A fictional calc, used only to exercise the text rewrite.
const DOC = [
  '---',
  'project: Fictional test barrel (invented)',
  '---',
  '# Barrel vault',
  '',
  'Prose with a # hash and `L = 1 m` in it.',
  '',
  '```given',
  'L = 6.4 m           # clear span between springings [3 m, 12 m]',
  't = 0.23 m          # ring thickness',
  'gamma = 18 kN/m^3   # brick masonry',
  '```',
  '',
  '```calc',
  'H = gamma * t * L^2 / (8 * 0.5 m) to kN/m  # thrust',
  '```',
  '',
].join('\n');

/** Lines of a and b that differ, as [lineNumber, a, b]. */
function changedLines(a: string, b: string): Array<[number, string, string]> {
  const x = a.split('\n'), y = b.split('\n');
  const out: Array<[number, string, string]> = [];
  for (let i = 0; i < Math.max(x.length, y.length); i++) if (x[i] !== y[i]) out.push([i + 1, x[i]!, y[i]!]);
  return out;
}

describe('rewriteGivenValues', () => {
  it('rewriteGivenValues(doc, {L}) replaces only the value text and keeps the comment column', () => {
    const r = rewriteGivenValues(DOC, { L: '7 m' });
    expect(r.changed).toEqual(['L']);
    expect(changedLines(DOC, r.text)).toEqual([
      [9, 'L = 6.4 m           # clear span between springings [3 m, 12 m]', 'L = 7 m             # clear span between springings [3 m, 12 m]'],
    ]);
  });

  it('rewriteGivenValues(doc, …) reads back: the new document evaluates with the new value', () => {
    const r = rewriteGivenValues(DOC, { L: '7.5 m', gamma: '20 kN/m^3' });
    const cells = compile(r.text).graph.byId;
    expect(cells.get('L')!.source).toBe('7.5 m');
    expect(cells.get('gamma')!.source).toBe('20 kN/m^3');
    expect(cells.get('L')!.range?.hi).toBe('12 m');
    expect(r.changed).toEqual(['L', 'gamma']);
  });

  it('rewriteGivenValues keeps CRLF line endings byte-for-byte', () => {
    const crlf = DOC.replace(/\n/g, '\r\n');
    const r = rewriteGivenValues(crlf, { t: '0.3 m' });
    expect(r.text).toBe(crlf.replace('t = 0.23 m          # ring', 't = 0.3 m           # ring'));
    expect(r.text.match(/\r\n/g)!.length).toBe(crlf.match(/\r\n/g)!.length);
    expect(r.text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });

  it('rewriteGivenValues keeps lone-CR line endings and a byte order mark', () => {
    const cr = '\uFEFF' + DOC.replace(/\n/g, '\r');
    const r = rewriteGivenValues(cr, { t: '0.3 m' });
    expect(r.text).toBe(cr.replace('t = 0.23 m          #', 't = 0.3 m           #'));
  });

  it('rewriteGivenValues lets a longer value push the comment right, keeping one space', () => {
    const r = rewriteGivenValues(DOC, { t: '230 mm + 12.5 mm + 0.125 m' });
    expect(r.text).toContain('\nt = 230 mm + 12.5 mm + 0.125 m # ring thickness\n');
  });

  it('rewriteGivenValues leaves a "#" inside quotes alone, in the value and in the old text', () => {
    const doc = '```given\nlabel = "bay #3"   # which bay\nn = 4 # count\n```\n';
    const r = rewriteGivenValues(doc, { label: '"bay #4 (west)"' });
    expect(r.text).toBe('```given\nlabel = "bay #4 (west)" # which bay\nn = 4 # count\n```\n');
  });

  it('rewriteGivenValues keeps a line without comment as it was, including trailing spaces', () => {
    const doc = '```given\nn = 4   \nm = 2\n```\n';
    expect(rewriteGivenValues(doc, { n: '5' }).text).toBe('```given\nn = 5   \nm = 2\n```\n');
  });

  it('rewriteGivenValues keeps a tab before the comment', () => {
    const doc = '```given\nL = 6.4 m\t# span\n```\n';
    expect(rewriteGivenValues(doc, { L: '7.25 m' }).text).toBe('```given\nL = 7.25 m\t# span\n```\n');
  });

  it('rewriteGivenValues folds a multi-line value onto its first line and keeps every comment at its column', () => {
    const doc = [
      '```given',
      'spans = [3 m,     # west bay',
      '         4.5 m,   # middle',
      '         3 m]     # east bay',
      'h = 2 m           # pier height',
      '```',
      '',
    ].join('\r\n');
    const r = rewriteGivenValues(doc, { spans: '[3.2 m, 4.5 m, 3 m]', h: '2.4 m' });
    expect(r.text).toBe([
      '```given',
      'spans = [3.2 m, 4.5 m, 3 m] # west bay',
      '                  # middle',
      '                  # east bay',
      'h = 2.4 m         # pier height',
      '```',
      '',
    ].join('\r\n'));
    expect(r.notes[0]).toMatch(/spans: the value now fits on line 2/);
    expect(compile(r.text).graph.byId.get('h')!.source).toBe('2.4 m');
  });

  it('rewriteGivenValues drops continuation lines without comments', () => {
    const doc = '```given\nw = {a: 1,\n     b: 2}\nk = 1\n```\n';
    expect(rewriteGivenValues(doc, { w: '{a: 3, b: 2}' }).text).toBe('```given\nw = {a: 3, b: 2}\nk = 1\n```\n');
  });

  it('rewriteGivenValues keeps unicode text in comments, values and prose byte-for-byte', () => {
    const doc = '# Gewölbe — ½ bay\n\n```given\nb = 1.2 m  # Breite — ⌀ ≈ 1 m, “quoted” 🧱\nname = "Façade Ø"  # 名称\n```\n';
    const r = rewriteGivenValues(doc, { b: '1.35 m', name: '"Façade Ø2"' });
    expect(r.text).toBe('# Gewölbe — ½ bay\n\n```given\nb = 1.35 m # Breite — ⌀ ≈ 1 m, “quoted” 🧱\nname = "Façade Ø2" # 名称\n```\n');
    expect(Buffer.from(r.text, 'utf8').toString('utf8')).toBe(r.text);
  });

  it('rewriteGivenValues skips values equal to the document\'s', () => {
    const r = rewriteGivenValues(DOC, { L: '6.4 m', t: ' 0.23 m ' });
    expect(r.changed).toEqual([]);
    expect(r.text).toBe(DOC);
  });

  it('rewriteGivenValues skips the document\'s value written another way (6.40 m, 6400 mm for 6.4 m): no change, the text kept', () => {
    const r = rewriteGivenValues(DOC, { L: '6.40 m', t: '230 mm' });
    expect(r.changed).toEqual([]);
    expect(r.text).toBe(DOC);
    // Another value is still written.
    expect(rewriteGivenValues(DOC, { L: '6.41 m' }).changed).toEqual(['L']);
  });

  it('rewriteGivenValues refuses unknown names, calc values, bad text — and changes nothing', () => {
    const cases: Array<[Record<string, string>, RegExp]> = [
      [{ span: '7 m' }, /no input called "span"/],
      [{ H: '7 kN/m' }, /"H" is a calc value, not a given input/],
      [{ L: '7 m\nt = 1 m' }, /must be one line/],
      [{ L: '7 m # sneaky' }, /must not contain "#"/],
      [{ L: '7 m +' }, /cannot read the new value/],
      [{ L: '   ' }, /is empty/],
      [{ L: '7 m', nope: '1' }, /no input called "nope"/],
    ];
    for (const [changes, message] of cases) {
      expect(() => rewriteGivenValues(DOC, changes)).toThrow(RewriteError);
      expect(() => rewriteGivenValues(DOC, changes)).toThrow(message);
    }
  });

  it('rewriteGivenValues refuses an input defined twice', () => {
    const doc = '```given\nL = 1 m\nL = 2 m\n```\n';
    expect(() => rewriteGivenValues(doc, { L: '3 m' })).toThrow(/more than once/);
  });

  it('rewriteGivenValues handles an indented statement and no space around "="', () => {
    const doc = '```given\n  L=6.4 m # span\n```\n';
    expect(rewriteGivenValues(doc, { L: '7 m' }).text).toBe('```given\n  L=7 m   # span\n```\n');
  });
});

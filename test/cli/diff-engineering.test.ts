/**
 * vaultbook diff reports what changed in the engineering: formulas, descriptions, ranges and display
 * units as such, and lists (hinges) compared by meaning rather than by index.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { diffCommand } from '../../bin/commands/diff.js';
import { alignLists, diffValue } from '../../bin/diff/values.js';
import type { DocumentDiff } from '../../bin/diff/document.js';
import type { ValueEntry } from '../../engine/summary.js';
import { toJsonValue } from '../../engine/index.js';
import { math } from '../../cells/math.js';

// A fictional lintel, revised: the moment coefficient, a description, a range and a display unit change.
const OLD = ['---', 'title: Lintel (fictional)', '---', '',
  '```given', 'L = 6 m      # span [3 m, 12 m]', 'q = 10 kN/m  # load', '```', '',
  '```calc', 'M = q * L^2 / 8 to kN m   # midspan moment', 'V = q * L / 2             # end shear', 'R = V to kN', '```', ''].join('\n');
const NEW = ['---', 'title: Lintel (fictional)', '---', '',
  '```given', 'L = 6 m      # clear span [3 m, 15 m]', 'q = 10 kN/m  # load', '```', '',
  '```calc', 'M = q * L^2 / 10 to kN m  # midspan moment, ends partly fixed', 'V = q*L/2   # end shear', 'R = V to N', '```', ''].join('\n');

let dir = '';
const write = (name: string, text: string) => { const p = join(dir, name); writeFileSync(p, text); return p; };

async function diff(a: string, b: string, json: boolean) {
  const out: string[] = [];
  const code = await diffCommand([a, b, ...(json ? ['--json'] : [])], (s) => out.push(s), () => {});
  return { code, out: out.join('\n') };
}

beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'vaultbook-diff-eng-')); });

describe('diff reports changed definitions', () => {
  it('a changed formula is reported old → new as written, with its line, and its result is marked', async () => {
    const [a, b] = [write('old.md', OLD), write('new.md', NEW)];
    const d = JSON.parse((await diff(a, b, true)).out) as DocumentDiff;
    expect(d.definitions.filter((c) => c.what === 'formula')).toEqual([
      { name: 'M', kind: 'calc', line_old: 11, line_new: 11, what: 'formula', old: 'q * L^2 / 8', new: 'q * L^2 / 10' },
    ]);
    const text = (await diff(a, b, false)).out;
    expect(text).toMatch(/^\s+M\s+formula\s+q \* L\^2 \/ 8 → q \* L\^2 \/ 10\s+line 11$/m);
    // wL²/8 = 45 kN m against wL²/10 = 36 kN m (beam formulas, common practice).
    expect(text).toMatch(/^\s+M\s+45 kN m → 36 kN m\s+−20 %\s+formula changed, line 11$/m);
  });

  it('spacing alone is not a changed formula', async () => {
    const d = JSON.parse((await diff(write('o2.md', OLD), write('n2.md', NEW), true)).out) as DocumentDiff;
    expect(d.definitions.find((c) => c.name === 'V' && c.what === 'formula')).toBeUndefined();
  });

  it('changed descriptions, ranges and display units are reported as such', async () => {
    const d = JSON.parse((await diff(write('o3.md', OLD), write('n3.md', NEW), true)).out) as DocumentDiff;
    const rest = d.definitions.filter((c) => c.what !== 'formula').map((c) => [c.name, c.what, c.old, c.new]);
    expect(rest).toEqual([
      ['L', 'description', 'span', 'clear span'],
      ['L', 'range', '[3 m, 12 m]', '[3 m, 15 m]'],
      ['M', 'description', 'midspan moment', 'midspan moment, ends partly fixed'],
      ['R', 'display unit', 'kN', 'N'],
    ]);
    const text = (await diff(write('o4.md', OLD), write('n4.md', NEW), false)).out;
    expect(text).toContain('Definitions changed (5)');
    expect(text).toMatch(/^\s+L\s+description\s+"span" → "clear span"\s+line 6$/m);
    expect(text).toMatch(/^\s+R\s+display unit\s+kN → N\s+line 13$/m);
  });
});

/** A list of hinges in the JSON shape of the summary. */
function hinges(list: Array<[number, string]>): ValueEntry {
  const value = list.map(([angle, face]) => ({ angle: math.unit(angle, 'deg'), face }));
  return { ...toJsonValue({ hinges: value }, { sigfigs: 4 }), kind: 'calc', line: 1 };
}

describe('lists are compared by meaning', () => {
  const three: Array<[number, string]> = [[-53.13, 'intrados'], [-21.25, 'extrados'], [35.07, 'intrados']];

  it('a hinge added between others is one hinge added, not the later ones moved', () => {
    const changes = diffValue(hinges(three), hinges([[-53.13, 'intrados'], [-40, 'extrados'], [-21.25, 'extrados'], [35.07, 'intrados']]), 1e-9);
    expect(changes.map((c) => [c.path, c.change, c.item, c.new?.text])).toEqual([['.hinges', 'item added', { old: null, new: 1 }, '{angle: −40 deg, face: extrados}']]);
  });

  it('a hinge removed is one hinge removed', () => {
    const changes = diffValue(hinges(three), hinges([three[0]!, three[2]!]), 1e-9);
    expect(changes.map((c) => [c.change, c.item, c.old?.text])).toEqual([['item removed', { old: 1, new: null }, '{angle: −21.25 deg, face: extrados}']]);
  });

  it('a hinge that moves is reported moved, with both positions', () => {
    const changes = diffValue(hinges(three), hinges([three[0]!, [-19.38, 'extrados'], three[2]!]), 1e-9);
    expect(changes.map((c) => [c.change, c.item, c.old?.text, c.new?.text])).toEqual([
      ['item moved', { old: 1, new: 1 }, '{angle: −21.25 deg, face: extrados}', '{angle: −19.38 deg, face: extrados}'],
    ]);
  });

  it('a hinge on the other face is never the same hinge', () => {
    const changes = diffValue(hinges([[-21.25, 'extrados']]), hinges([[-21.25, 'intrados']]), 1e-9);
    expect(changes.map((c) => c.change)).toEqual(['item removed', 'item added']);
  });

  it('alignLists keeps order and pairs the nearest items', () => {
    const items = (xs: number[]) => xs.map((x) => ({ value: x, unit: null, text: String(x) }));
    expect(alignLists(items([1, 2, 3]), items([1, 2, 2.5, 3]))).toEqual([[0, 0], [1, 1], [null, 2], [2, 3]]);
  });

  it('a hinge that moves 12° along its face while its N and T change is one hinge moved; 20° is one removed and one added', () => {
    const withForces = (list: Array<[number, string, number]>): ValueEntry => {
      const value = list.map(([angle, face, N]) => ({ angle: math.unit(angle, 'deg'), face, N: math.unit(N, 'kN'), T: math.unit(N / 20, 'kN') }));
      return { ...toJsonValue({ hinges: value }, { sigfigs: 4 }), kind: 'calc', line: 1 };
    };
    const before = withForces([[-46.22, 'intrados', 142.8], [-14.15, 'extrados', 60], [21.25, 'intrados', 101.8]]);
    const moved = diffValue(before, withForces([[-34, 'intrados', 121.8], [0, 'extrados', 75], [34, 'intrados', 121.8]]), 1e-9);
    expect(moved.map((c) => [c.change, c.item])).toEqual([
      ['item moved', { old: 0, new: 0 }], ['item moved', { old: 1, new: 1 }], ['item moved', { old: 2, new: 2 }],
    ]);
    const far = diffValue(before, withForces([[-46.22, 'intrados', 142.8], [-14.15, 'extrados', 60], [41.25, 'intrados', 101.8]]), 1e-9);
    expect(far.map((c) => c.change)).toEqual(['item removed', 'item added']);
  });

  it('diff of a ring with P moved from 2 m to 3 m: every hinge moved, the mechanism keeps its 53.13° extrados hinge, labels read "hinge …"', async () => {
    const ring = (at: string) => ['---', 'title: Ring (fictional)', '---', '', '```calc',
      'r = arch_ring({shape: "circular", span: 6 m, rise: 1.5 m, thickness: 0.34 m, unit_weight: 18 kN/m^3})',
      `a = arch_limit(r, {fill_unit_weight: 19 kN/m^3, fill_level: 2.24 m, P: 60 kN, P_at: ${at}})`, '```', ''].join('\n');
    const [a, b] = [write('p2.md', ring('2 m')), write('p3.md', ring('3 m'))];
    const d = JSON.parse((await diff(a, b, true)).out) as DocumentDiff;
    const fields = d.results.find((v) => v.name === 'a')!.fields;
    expect(fields.filter((f) => f.path === '.hinges').map((f) => f.change)).toEqual(['item moved', 'item moved', 'item moved']);
    const mech = fields.filter((f) => f.path === '.mechanism');
    // The springing extrados hinge of the right half is at the springing joint of a 6 m × 1.5 m segment: half-angle 53.13°.
    expect(mech.find((f) => f.old?.text.startsWith('{angle: 53.13 deg, face: extrados'))?.change).toBe('item moved');
    const sliding = fields.filter((f) => f.path === '.sliding');
    expect(sliding.every((f) => f.change === 'item moved')).toBe(true);
    const text = (await diff(a, b, false)).out;
    expect(text).toMatch(/a\.mechanism .* hinge (added|removed|moved)/);
    expect(text).not.toMatch(/a\.mechanism .* item /);
  });

  it('diff of the arch-ring template with a higher rise: springing hinges move, the crown hinge stays at the crown and rises with it', async () => {
    const template = readFileSync(new URL('../../templates/arch-ring.md', import.meta.url), 'utf8');
    const risen = template.replace(/^f = 1\.5 m/m, 'f = 1.6 m');
    expect(risen).not.toBe(template);
    const d = JSON.parse((await diff(write('ring-a.md', template), write('ring-b.md', risen), true)).out) as DocumentDiff;
    const aG = d.results.find((v) => v.name === 'a_G')!.fields.filter((f) => f.path === '.hinges');
    // Under self-weight and symmetric fill the least-thrust line touches the extrados at the crown (0°) and the
    // intrados at the springings (Heyman, The Stone Skeleton, 1995, ch. 3; from memory): only the springing hinges move.
    // Each hinge is paired with itself; the crown hinge keeps its angle (0°) while its height and N follow the rise.
    expect(aG.map((f) => [f.change, f.item])).toEqual([['item moved', { old: 0, new: 0 }], ['item moved', { old: 1, new: 1 }], ['item moved', { old: 2, new: 2 }]]);
    expect(aG[1]!.old!.text).toMatch(/^\{angle: 0 deg, face: extrados/);
    expect(aG[1]!.new!.text).toMatch(/^\{angle: 0 deg, face: extrados/);
  });
});

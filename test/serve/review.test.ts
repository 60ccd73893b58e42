import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { compile, documentUnitSystem, startSession } from '../../engine/index.js';
import { math } from '../../cells/math.js';
import { compareToDocument, changeBadge, checkState, flipTone, inputChanges, renderReviewPanel } from '../../site/review.js';
import { withDocumentUnit } from '../../site/editor.js';
import { readInputValue, sameValue, valueOfText } from '../../engine/values/input-value.js';
import { FIXTURES, REPO } from './helpers.js';

const TEXT = readFileSync(join(FIXTURES, 'barrel.md'), 'utf8');

async function reviewAfter(edits: Record<string, string>) {
  const doc = compile(TEXT, { file: 'barrel.md' });
  const session = startSession(doc);
  const baseline = new Map(await session.settle());
  for (const [n, v] of Object.entries(edits)) expect(session.setInput(n, v)).toBeNull();
  const now = await session.settle();
  const changes = new Map(doc.graph.cells.map((c) => [c.id, compareToDocument(c, baseline.get(c.id), now.get(c.id), 3)]));
  session.dispose();
  return { doc, changes };
}

describe('compareToDocument', () => {
  it('compareToDocument gives the change of a result in its display unit, absolute and in per cent', async () => {
    // H = w L^2 / (8 f): with w nearly unchanged, 4.8 m → 6 m raises H by about (6/4.8)^2 − 1 = 56 %
    // less the smaller arc factor (k_arc) — hand check: w 10.84 → 10.58 kN/m², H 26.0 → 39.7 kN/m.
    const { changes } = await reviewAfter({ L: '6 m' });
    const h = changes.get('H')!;
    expect(h).toMatchObject({ kind: 'quantity', before: '26 kN/m', after: '39.7 kN/m', delta: '+13.7 kN/m', sign: 1 });
    expect(h.kind === 'quantity' && h.percent).toBe('+52.7 %');
    expect(changes.get('W')).toBeNull(); // the wall does not depend on the span
    expect(changes.get('x_R')).toMatchObject({ kind: 'quantity', sign: -1 });
  });

  it('compareToDocument gives a kernel result of a calc in ft and pcf in kip (the units its sheet shows)', async () => {
    // Fictional ring in US units; the change is compared in kip, as the sheet prints H (kip = 4448.2216152605 N, NIST SP 811).
    const text = ['```given', 'L = 20 ft', 'f = 5 ft', 't = 1.25 ft', 'w = 120 pcf', '```',
      '```calc', 'r = arch_ring({shape: "circular", span: L, rise: f, thickness: t, unit_weight: w, depth: 3 ft})', 'a = arch_limit(r)', 'H = a.H_min', '```', ''].join('\n');
    const doc = compile(text, { file: 'us.md' });
    const session = startSession(doc);
    const baseline = new Map(await session.settle());
    expect(session.setInput('L', '22 ft')).toBeNull();
    const now = await session.settle();
    const units = documentUnitSystem(doc);
    const h = compareToDocument(doc.graph.byId.get('H')!, baseline.get('H'), now.get('H'), 3, units);
    session.dispose();
    expect(units).toBe('us');
    expect(h).toMatchObject({ kind: 'quantity', sign: 1 });
    const kip = (s: unknown) => +((s as { value: { toNumber(u: string): number } }).value.toNumber('N') / 4448.2216152605).toPrecision(3);
    const shown = h?.kind === 'quantity' ? [h.before, h.after] : null;
    expect(shown).toEqual([`${kip(baseline.get('H'))} kip`, `${kip(now.get('H'))} kip`]);
  });

  it('compareToDocument marks a check whose verdict flips, with both utilizations', async () => {
    const { changes } = await reviewAfter({ L: '6 m' });
    expect(changes.get('c_third')).toMatchObject({ kind: 'check', before: true, after: false, flipped: true });
    const tip = changes.get('c_tip')!;
    expect(tip).toMatchObject({ kind: 'check', flipped: false, before: true, after: true });
    expect(changeBadge(changes.get('c_third')!)).toContain('✗ HOLDS → FAILS');
    expect(changeBadge(tip)).toMatch(/utilization 0\.52 → 0\.75/); // rounded up, as the sheet prints them
  });

  it('compareToDocument reports a result that now fails to compute', async () => {
    const { changes } = await reviewAfter({ f: '0 m' });
    expect(changes.get('H')).toMatchObject({ kind: 'state', before: 'a value', after: 'an error' });
    expect(changes.get('sigma')).toMatchObject({ kind: 'state', after: 'blocked by H' });
  });

  it('compareToDocument sees no change for the same value written another way', async () => {
    const { changes } = await reviewAfter({ L: '4800 mm' });
    expect([...changes.values()].filter((c) => c !== null)).toEqual([]);
  });
});

describe('a check that can no longer be evaluated', () => {
  // Reproduces issue 16: in the cross-vault template, b_bay = 4 m puts the thrust above the buttress
  // top, so the four buttress checks cannot be evaluated; they were shown as green "now holds".
  it('compareToDocument, changeBadge and renderReviewPanel report "holds → not evaluated" as a warning, never green', async () => {
    const text = readFileSync(join(REPO, 'templates', 'cross-vault.md'), 'utf8');
    const doc = compile(text, { file: 'cross-vault.md' });
    const session = startSession(doc);
    const baseline = new Map(await session.settle());
    expect(session.setInput('b_bay', '4 m')).toBeNull();
    const now = await session.settle();
    session.dispose();
    const flips = doc.graph.cells.flatMap((c) => {
      const ch = compareToDocument(c, baseline.get(c.id), now.get(c.id), 4);
      return ch?.kind === 'check' && ch.flipped ? [ch] : [];
    });
    const lost = flips.filter((f) => f.after === null);
    expect(lost.map((f) => f.id).sort()).toEqual(['c_bearing', 'c_overturn', 'c_slide', 'c_third']);
    for (const f of lost) {
      expect(f.before).toBe(true);
      const badge = changeBadge(f);
      expect(badge).toContain('lv-flip-warn');
      expect(badge).toContain('⚠ HOLDS → NOT EVALUATED');
      expect(badge).not.toMatch(/lv-flip-pass|✓/);
    }
    const panel = renderReviewPanel({
      file: 'cross-vault.md', inputs: inputChanges(doc, new Map([['b_bay', '4 m']])),
      flips: flips.map((f) => ({ id: f.id, label: f.id, before: f.before, after: f.after })),
      changedResults: flips.length, dropped: [], message: null, writing: false,
    });
    expect(panel).toContain('5 checks changed state');
    expect(panel).toMatch(/<li class="lv-fliprow-warn"><a[^>]*>c_third<\/a> ⚠ holds → not evaluated<\/li>/);
    expect(panel).toMatch(/<li class="lv-fliprow-fail"><a[^>]*>c_pocket<\/a> ✗ holds → fails<\/li>/);
    expect(panel).not.toContain('lv-fliprow-pass');
  });

  it('flipTone and checkState use exactly three states', () => {
    expect([true, false, null].map((p) => checkState(p))).toEqual(['holds', 'fails', 'not evaluated']);
    expect([true, false, null].map((p) => flipTone(p))).toEqual(['pass', 'fail', 'warn']);
  });
});

describe('compareToDocument on a record result (a kernel call)', () => {
  const ARCH = readFileSync(join(FIXTURES, 'arch.md'), 'utf8');

  async function archAfter(edits: Record<string, string>) {
    const doc = compile(ARCH, { file: 'arch.md' });
    const session = startSession(doc);
    const baseline = new Map(await session.settle());
    const cellA = doc.graph.cells.find((c) => c.name === 'a')!;
    const before = baseline.get(cellA.id);
    for (const [n, v] of Object.entries(edits)) expect(session.setInput(n, v)).toBeNull();
    const after = (await session.settle()).get(cellA.id);
    session.dispose();
    return { change: compareToDocument(cellA, before, after, 3), before, after };
  }

  it('names each field that moved, with its change in its own unit and in per cent', async () => {
    // The expected change of H_min is read from the two results themselves: this checks the
    // review's arithmetic and wording, not the kernel (the kernel has its own tests).
    const { change, before, after } = await archAfter({ t: '0.4 m' });
    expect(change?.kind).toBe('record');
    if (change?.kind !== 'record') return;
    const names = change.fields.map((f) => f.name);
    expect(names).toEqual(expect.arrayContaining(['H_min', 'H_max', 'gsf', 't_min']));
    const h = change.fields.find((f) => f.name === 'H_min')!;
    const [hb, ha] = [(before as { value: { H_min: { toNumber(u: string): number } } }).value.H_min.toNumber('kN'), (after as { value: { H_min: { toNumber(u: string): number } } }).value.H_min.toNumber('kN')];
    expect(h.delta).toMatch(/^\+[\d.]+ kN$/);
    expect(Number(h.delta!.slice(1, -3))).toBeCloseTo(ha - hb, 1);
    expect(h.percent).toBe(`+${((ha - hb) / hb * 100).toPrecision(3)} %`);
    const badge = changeBadge(change);
    expect(badge).toContain('H_min +');
    expect(badge).not.toContain('>changed<');
    expect(badge).toMatch(/and \d+ more fields?/);
  });

  it('sees no change when the record is the same', async () => {
    expect((await archAfter({ t: '300 mm' })).change).toBeNull();
  });
});

describe('compareToDocument of a given input', () => {
  it('shows an edited input before and after with the digits each was written with, not the sheet\'s 3 figures', async () => {
    const doc = compile(['```given', 'p = 1.0004  # factor', 'L = 5.4 m  # span', '```'].join('\n'), { file: 'p.md' });
    const session = startSession(doc);
    const baseline = new Map(await session.settle());
    expect(session.setInput('p', '1.0005')).toBeNull();
    expect(session.setInput('L', '5.4125 m')).toBeNull();
    const now = await session.settle();
    session.dispose();
    const change = (id: string) => compareToDocument(doc.graph.cells.find((c) => c.id === id)!, baseline.get(id), now.get(id), 3);
    // At 3 figures both sides of each read alike ("1 → 1", "5.41 m" for 5.4125 m), which hides the edit.
    expect(change('p')).toMatchObject({ kind: 'quantity', before: '1.0004', after: '1.0005' });
    expect(change('L')).toMatchObject({ kind: 'quantity', before: '5.4 m', after: '5.4125 m' });
  });
});

describe('review panel', () => {
  it('inputChanges and renderReviewPanel list document → now for each changed input', () => {
    const doc = compile(TEXT, { file: 'barrel.md' });
    const overrides = new Map([['t', '0.3 m'], ['L', '6 m']]);
    const inputs = inputChanges(doc, overrides);
    expect(inputs).toEqual([
      { name: 'L', from: '4.8 m', to: '6 m', line: 21 },
      { name: 't', from: '0.23 m', to: '0.3 m', line: 23 },
    ]);
    const html = renderReviewPanel({ file: 'barrel.md', inputs, flips: [{ id: 'c_third', label: 'middle third', before: true, after: false }], changedResults: 9, dropped: ['old'], message: null, writing: false });
    expect(html).toContain('<td class="lv-from">4.8 m</td>');
    expect(html).toContain('middle third</a> ✗ holds → fails');
    expect(html).toContain('no longer applied: old');
    expect(html).toContain('data-action="write"');
    expect(renderReviewPanel({ file: 'x', inputs: [], flips: [], changedResults: 0, dropped: [], message: null, writing: false })).toBe('');
  });
});

describe('withDocumentUnit', () => {
  it('withDocumentUnit gives a bare number the document\'s unit and leaves anything else alone', () => {
    expect(withDocumentUnit('7', math.unit(6.4, 'm'))).toBe('7 m');
    expect(withDocumentUnit(' 7.5e-1 ', math.unit(6.4, 'm'))).toBe('7.5e-1 m');
    expect(withDocumentUnit('−2', math.unit(6.4, 'm'))).toBe('-2 m');
    expect(withDocumentUnit('20', math.unit('18 kN/m^3'))).toBe('20 kN/m^3');
    expect(withDocumentUnit('7 ft', math.unit(6.4, 'm'))).toBe('7 ft');
    expect(withDocumentUnit('2 * 3', math.unit(6.4, 'm'))).toBe('2 * 3');
    expect(withDocumentUnit('7', 12)).toBe('7');
  });

  it('readInputValue refuses a value of another dimension with the input\'s name and both dimensions', () => {
    const t = math.unit(0.215, 'm');
    expect(readInputValue('t', '3 kN', t)).toEqual({ ok: false, text: '3 kN', message: 't is length (m); "3 kN" is force (kN). Not applied.' });
    expect(readInputValue('t', '0.25 ft', t)).toMatchObject({ ok: true, text: '0.25 ft' });
    expect(readInputValue('t', '0.25', t)).toMatchObject({ ok: true, text: '0.25 m' });
    expect(readInputValue('t', '7 k', t).ok).toBe(false);
    expect(readInputValue('t', '7 +', t)).toMatchObject({ ok: false, message: expect.stringMatching(/^cannot read "7 \+"/) });
    expect(readInputValue('t', '  ', t)).toMatchObject({ ok: false, message: expect.stringMatching(/t needs a value/) });
    expect(readInputValue('n', '3', 2)).toMatchObject({ ok: true, value: 3 });
    expect(readInputValue('n', '3 m', 2).ok).toBe(false);
  });

  it('sameValue sees 5.40 m, 5.4 m and 5400 mm as one value, and 5.41 m as another', () => {
    expect(sameValue(valueOfText('5.40 m'), math.unit('5.4 m'))).toBe(true);
    expect(sameValue(valueOfText('5400 mm'), math.unit('5.4 m'))).toBe(true);
    expect(sameValue(valueOfText('5.41 m'), math.unit('5.4 m'))).toBe(false);
    expect(sameValue(valueOfText('5.4 kN'), math.unit('5.4 m'))).toBe(false);
  });
});

/**
 * The kernel reference: generated from the registrations, complete, committed and current.
 */
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { main } from '../../bin/cli.js';
import { cellFunctions } from '../../engine/library.js';
import { defineCellFunction } from '../../cells/define.js';
import { declaredFields, declaredParams, missingReference, referenceText, strayReference } from '../../bin/reference.js';
import { KERNEL_DOC, kernelDocument } from '../../bin/docs.js';

async function run(...argv: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

const ALL = [...cellFunctions.values()];

describe('reference text for every declaration', () => {
  it.each(ALL.map((f) => [f.name, f] as const))('%s documents every argument, option and result field, and its method', (_name, fn) => {
    expect(missingReference(fn)).toEqual([]);
  });

  it.each(ALL.map((f) => [f.name, f] as const))('%s has no reference text for something it does not declare', (_name, fn) => {
    expect(strayReference(fn)).toEqual([]);
  });

  it('missingReference(fn) names a declared field that has no text (the check can fail)', () => {
    const fn = defineCellFunction({
      name: 'probe', doc: 'A probe.', params: [{ name: 'options', type: { object: { a: 'm' } } }],
      returns: { object: { b: 'N', c: { list: { object: { d: 'rad' } } } } }, fn: () => ({}),
      reference: { params: { options: 'the options', 'options.a': 'a length' }, fields: { b: 'a force', c: 'a list' }, method: 'none' },
    });
    expect(missingReference(fn)).toEqual(['result field c.d']);
  });

  it('declaredParams(arch_limit) lists the loads record option by option, none required', () => {
    const entries = declaredParams(cellFunctions.get('arch_limit')!);
    expect(entries.map((e) => e.path)).toEqual(['ring', 'loads', 'loads.fill_unit_weight', 'loads.fill_level', 'loads.dead', 'loads.live', 'loads.live_from', 'loads.live_to', 'loads.P', 'loads.P_at', 'loads.spread', 'loads.fill_pressure', 'loads.axles', 'loads.axles.W', 'loads.axles.at']);
    expect(entries.filter((e) => e.required).map((e) => e.path)).toEqual(['ring']);
  });

  it('declaredParams(buttress) marks the required options', () => {
    const required = declaredParams(cellFunctions.get('buttress')!).filter((e) => e.required).map((e) => e.path);
    expect(required).toEqual(['options', 'options.height', 'options.width', 'options.depth', 'options.unit_weight', 'options.T']); // z_T is needed only when T > 0 (checked by the kernel)
  });

  it('declaredFields of a function returning one quantity is its result', () => {
    expect(declaredFields(cellFunctions.get('masonry_fk')!).map((e) => e.path)).toEqual(['result']);
  });
});

describe('docs/kernel.md', () => {
  it('is what npm run docs generates from the registrations (run npm run docs when this fails)', () => {
    expect(readFileSync(KERNEL_DOC, 'utf8')).toBe(kernelDocument());
  });

  it('holds each function\'s entry exactly as vaultbook help prints it', () => {
    const doc = readFileSync(KERNEL_DOC, 'utf8');
    for (const fn of ALL) expect(doc).toContain(referenceText(fn));
  });

  it('is linked from the README', () => {
    expect(readFileSync(new URL('../../README.md', import.meta.url), 'utf8')).toContain('](docs/kernel.md)');
  });
});

describe('vaultbook help', () => {
  it('help lists the commands and every kernel function', async () => {
    const r = await run('help');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/vaultbook check/);
    for (const fn of ALL) expect(r.out).toMatch(new RegExp(`^  ${fn.name}\\(`, 'm'));
  });

  it('help arch_limit prints every argument, result field, the method, assumptions and sources', async () => {
    const r = await run('help', 'arch_limit');
    expect(r.code).toBe(0);
    const fn = cellFunctions.get('arch_limit')!;
    for (const e of [...declaredParams(fn), ...declaredFields(fn)]) expect(r.out).toContain(`- \`${e.path}\` — `);
    expect(r.out).toMatch(/`loads\.P` — force, N \(shown in kN\); optional\./);
    expect(r.out).toMatch(/`hinges\.angle` — angle .*0 at the crown, negative on the left half/);
    expect(r.out).toMatch(/### Method\n\nLower-bound \(safe theorem\) limit analysis/);
    expect(r.out).toMatch(/### Assumptions\n\n- No tensile strength/);
    expect(r.out).toMatch(/### Sources\n\n- Heyman/);
  });

  it('help groin_vault says where z_thrust is measured from', async () => {
    const r = await run('help', 'groin_vault');
    expect(r.out).toMatch(/`z_thrust` — length, m\. Height above the springing at which the x-thrust acts on the corner: crown − h_thrust/);
    expect(r.out).toMatch(/`h_thrust` — length, m\. Depth below the crown/);
  });

  it('help cross_vault_figure and the README say z_x_min is the height of the horizontal thrust, not of the corner\'s resultant (its meaning since cross_vault\'s ΣH·z/ΣH)', async () => {
    const r = await run('help', 'cross_vault_figure');
    expect(r.out).toMatch(/least horizontal thrust at its height z_x_min \/ z_y_min/);
    expect(r.out).not.toMatch(/resultant at z_x_min/);
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    const bullet = readme.slice(readme.indexOf('- `cross_vault({'), readme.indexOf('- `flying_buttress({'));
    expect(bullet).toMatch(/height of the horizontal thrust \(`z_x_min`, …\) and the arm of `V_corner` \(`a_x_min`, …\)/);
    expect(bullet).not.toMatch(/height of the corner's resultant/);
  });

  it('help on a command prints its usage', async () => {
    const r = await run('help', 'diff');
    expect(r).toMatchObject({ code: 0, out: expect.stringMatching(/^usage: vaultbook diff OLD NEW/) });
  });

  it('help on an unknown name exits 2 with a suggestion', async () => {
    const r = await run('help', 'arch_limt');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/no kernel function or command "arch_limt"; did you mean "arch_limit"\?/);
  });
});

/**
 * Every declared result field of every kernel function is always present — in ordinary states and at
 * the edges (a ring that holds no line of thrust, a wall that overturns, no live load, no friction
 * given): a number, Infinity for an unbounded quantity, or "not available" with its reason.
 * The inputs are invented for the test; the states they reach are checked by the assertions on
 * `safe`, `in_base` and the reasons, not assumed. No engineering value is compared here; the edge
 * states are chosen from facts of the trade: a semicircular ring thinner than t/R ≈ 0.107 holds no
 * line of thrust (Milankovitch's minimum, from memory; checked in test/cells/vault/arch), a parabola
 * is the funicular of load uniform on plan (common practice), and a wall whose resultant leaves its
 * base overturns (common practice). Issue 15's edges: a cross vault of 0.12 m webs over 6 m without a
 * solid pocket, whose deepest slices hold no line (test/cells/vault/groin/cross-vault.test.ts), an arched
 * flyer with a bounded greatest thrust (test/cells/supports/flyer.test.ts), a tie whose M30 thread governs
 * (EN 1993-1-8 Table 3.4; test/cells/supports/tie.test.ts) and a wall under a vertical load alone.
 */
import { describe, it, expect } from 'vitest';
import { math } from '../../cells/math.js';
import { cellFunctions } from '../../engine/library.js';
import { isNotAvailable } from '../../cells/not-available.js';
import type { FieldType } from '../../cells/define.js';

const u = (x: number, unit: string) => math.unit(x, unit);
const call = (name: string, ...args: unknown[]) => cellFunctions.get(name)!.call(...args) as Record<string, unknown>;

const semicircle = (t: number) => call('arch_ring', { shape: 'circular', span: u(6, 'm'), rise: u(3, 'm'), thickness: u(t, 'm'), unit_weight: u(18, 'kN/m^3') });
const parabola = call('arch_ring', { shape: 'parabolic', span: u(8, 'm'), rise: u(2, 'm'), thickness: u(0.4, 'm'), unit_weight: u(20, 'kN/m^3') });
const wall = (width: number, extra: object = {}) => call('buttress', {
  height: u(6, 'm'), width: u(width, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'), T: u(30, 'kN'), z_T: u(6, 'm'), ...extra,
});
const groin = call('groin_vault', { span_x: u(6, 'm'), thickness: u(0.2, 'm'), unit_weight: u(18, 'kN/m^3') });
const hemisphere = call('dome', { shape: 'spherical', radius: u(5, 'm'), half_angle: u(90, 'deg'), thickness: u(0.3, 'm'), unit_weight: u(18, 'kN/m^3') });
const pointedDome = call('dome', { shape: 'pointed', span: u(10, 'm'), rise: u(7, 'm'), thickness: u(0.4, 'm'), unit_weight: u(20, 'kN/m^3'), p: u(1, 'kN/m^2'), oculus_angle: u(0.4, 'rad'), lantern: u(50, 'kN') });
const thinCross = call('cross_vault', { span_x: u(6, 'm'), thickness: u(0.12, 'm'), unit_weight: u(18, 'kN/m^3'), dead: u(1, 'kN/m^2'), solid_level: u(0, 'm') });
const arched = call('flying_buttress', { shape: 'arched', span: u(4.5, 'm'), rise: u(2, 'm'), sag: u(0.5, 'm'), thickness: u(0.45, 'm'), unit_weight: u(22, 'kN/m^3'), strength: u(4, 'MPa') });
const barrel = call('barrel_membrane', { shape: 'circular', span: u(6, 'm'), rise: u(3, 'm'), length: u(10, 'm'), thickness: u(0.2, 'm'), unit_weight: u(18, 'kN/m^3') });

/** For each function returning a record: results in ordinary and edge states. */
const CASES: Record<string, Array<() => unknown>> = {
  arch_ring: [() => semicircle(0.4), () => parabola,
    () => call('arch_ring', { shape: 'circular', radius: u(3, 'm'), half_angle: u(90, 'deg'), thickness: u(0.3, 'm'), unit_weight: u(18, 'kN/m^3') })],
  arch_limit: [
    () => call('arch_limit', semicircle(0.4)), // safe, no live load: no load factor
    () => call('arch_limit', semicircle(0.1)), // too thin: holds no line of thrust
    () => call('arch_limit', semicircle(0.4), { P: u(50, 'kN'), P_at: u(1, 'm') }), // collapses under λ·P
    () => call('arch_limit', parabola, { live: u(1000, 'kN/m^2') }), // funicular live load: never collapses
    () => call('arch_limit', call('arch_ring', { shape: 'circular', span: u(10, 'm'), rise: u(0.3, 'm'), thickness: u(0.5, 'm'), unit_weight: u(20, 'kN/m^3') })), // H_max unbounded
  ],
  buttress: [() => wall(2), () => wall(1.2), () => wall(0.4), () => wall(2, { friction: 0.6, bearing: u(300, 'kN/m^2') }),
    () => call('buttress', { height: u(3, 'm'), width: u(0.45, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'), T: u(0, 'kN'), V: u(60, 'kN'), x_V: u(0.05, 'm') })], // vertical load alone, outside the middle third
  tie: [() => call('tie', { T: u(100, 'kN'), f_y: u(235, 'MPa') }),
    () => call('tie', { T: u(140, 'kN'), f_y: u(235, 'MPa'), f_u: u(360, 'MPa'), diameter: u(32, 'mm') }), // the thread governs
    () => call('tie', { T: u(2000, 'kN'), f_y: u(235, 'MPa'), f_u: u(360, 'MPa'), diameter: u(50, 'mm') })], // no bar of the series suffices
  groin_vault: [() => groin, () => call('groin_vault', { span_x: u(6, 'm'), span_y: u(4, 'm'), shape: 'pointed', g: u(4, 'kN/m^2'), fill_level: u(1, 'm'), fill_unit_weight: u(16, 'kN/m^3') })],
  web_membrane_at: [() => call('web_membrane_at', groin, u(2.5, 'm'), u(30, 'deg'))],
  vault_bays: [() => call('vault_bays', groin, 1), () => call('vault_bays', groin, 4)],
  barrel_membrane: [() => barrel, () => call('barrel_membrane', { shape: 'parabolic', span: u(6, 'm'), rise: u(1.5, 'm'), length: u(8, 'm'), g: u(5, 'kN/m^2'), p: u(1, 'kN/m^2') })],
  membrane_at: [() => call('membrane_at', barrel, u(1, 'm'), u(20, 'deg'))],
  thrust_line: [() => call('thrust_line', semicircle(0.4), {}, u(14.5, 'kN'))],
  dome: [
    () => hemisphere,
    () => call('dome', { shape: 'spherical', radius: u(5, 'm'), half_angle: u(60, 'deg'), thickness: u(0.3, 'm'), unit_weight: u(18, 'kN/m^3'), p: u(1, 'kN/m^2') }), // a cap: no hoop tension
    () => call('dome', { shape: 'spherical', radius: u(5, 'm'), half_angle: u(90, 'deg'), thickness: u(0.3, 'm'), unit_weight: u(18, 'kN/m^3'), oculus_angle: u(15, 'deg'), lantern: u(40, 'kN') }),
    () => pointedDome,
  ],
  dome_at: [() => call('dome_at', hemisphere, u(30, 'deg'))],
  dome_limit: [() => call('dome_limit', hemisphere), () => call('dome_limit', call('dome', { shape: 'spherical', radius: u(5, 'm'), half_angle: u(90, 'deg'), thickness: u(0.05, 'm'), unit_weight: u(18, 'kN/m^3') })),
    () => call('dome_limit', pointedDome)],
  cross_vault: [() => call('cross_vault', { span_x: u(5, 'm'), thickness: u(0.25, 'm'), unit_weight: u(18, 'kN/m^3') }),
    () => thinCross, // a slice holds no line of thrust
    () => call('cross_vault', { span_x: u(6, 'm'), span_y: u(4.2, 'm'), shape: 'pointed', thickness: u(0.4, 'm'), unit_weight: u(18, 'kN/m^3'), solid_level: u(0, 'm') }), // bounded H_max
    () => call('cross_vault', { span_x: u(6, 'm'), span_y: u(4.2, 'm'), shape: 'segmental', rise: u(2, 'm'), thickness: u(0.25, 'm'), unit_weight: u(18, 'kN/m^3'), dead: u(1, 'kN/m^2') }),
    () => call('cross_vault', { span_x: u(6, 'm'), shape: 'stilted', stilt: u(0.5, 'm'), thickness: u(0.25, 'm'), unit_weight: u(18, 'kN/m^3'), fill_level: u(1, 'm'), fill_unit_weight: u(16, 'kN/m^3') })],
  flying_buttress: [() => call('flying_buttress', { span: u(4, 'm'), rise: u(2, 'm'), thickness: u(0.4, 'm'), unit_weight: u(20, 'kN/m^3') }),
    () => arched],
  arch_scan: [
    () => call('arch_scan', semicircle(0.4), {}, { axles: [u(50, 'kN'), u(50, 'kN')], spacing: [u(1.8, 'm')], steps: 20 }),
    () => call('arch_scan', semicircle(0.1), {}, { axles: [u(50, 'kN')], steps: 10 }), // too thin: no position carries the vehicle
  ],
};

function declaredFields(type: FieldType): string[] | null {
  if (typeof type === 'object' && 'object' in type) return Object.keys(type.object);
  if (typeof type === 'object' && 'list' in type) return declaredFields(type.list);
  return null;
}

function records(value: unknown): Array<Record<string, unknown>> {
  return Array.isArray(value) ? (value as Array<Record<string, unknown>>) : [value as Record<string, unknown>];
}

describe('every declared field of every kernel function is always present', () => {
  const withFields = [...cellFunctions.values()].filter((f) => declaredFields(f.returns) !== null);

  it('covers every registered function that returns a record', () => {
    expect(withFields.map((f) => f.name).sort()).toEqual(Object.keys(CASES).sort());
  });

  for (const f of withFields) {
    it(`${f.name}(…) returns exactly its declared fields, each a value, Infinity or "not available" with a reason`, () => {
      const fields = declaredFields(f.returns)!;
      for (const make of CASES[f.name] ?? []) {
        for (const record of records(make())) {
          expect(Object.keys(record).sort()).toEqual([...fields].sort());
          for (const field of fields) {
            const v = record[field];
            expect(v, `${f.name}.${field}`).not.toBeUndefined();
            if (isNotAvailable(v)) expect(v.reason.length, `${f.name}.${field} reason`).toBeGreaterThan(10);
          }
        }
      }
    });
  }

  it('the edge states are reached: an unsafe ring, an unbounded H_max, λ = ∞, a wall that overturns', () => {
    const thin = call('arch_limit', semicircle(0.1));
    expect(thin.safe).toBe(false);
    expect(String(thin.H_min)).toMatch(/^not available — the ring holds no line of thrust \(gsf 0\.\d\d < 1\)$/);
    const flat = call('arch_limit', call('arch_ring', { shape: 'circular', span: u(10, 'm'), rise: u(0.3, 'm'), thickness: u(0.5, 'm'), unit_weight: u(20, 'kN/m^3') }));
    expect((flat.H_max as math.Unit).toNumber('N')).toBe(Infinity);
    expect(call('arch_limit', parabola, { live: u(1000, 'kN/m^2') }).load_factor).toBe(Infinity);
    const over = wall(0.4);
    expect(over.in_base).toBe(false);
    expect(isNotAvailable(over.sigma_max)).toBe(true);
    expect(thinCross.safe).toBe(false);
    expect(isNotAvailable(thinCross.H_x_min)).toBe(true);
    expect(Number.isFinite((arched.H_max as math.Unit).toNumber('N'))).toBe(true);
    expect(isNotAvailable(arched.H_crush)).toBe(false);
    expect(call('tie', { T: u(140, 'kN'), f_y: u(235, 'MPa'), f_u: u(360, 'MPa'), diameter: u(32, 'mm') }).governs).toBe('thread');
    expect(call('buttress', { height: u(3, 'm'), width: u(0.45, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'), T: u(0, 'kN'), V: u(60, 'kN'), x_V: u(0.05, 'm') }).middle_third).toBe(false);
    expect(isNotAvailable(call('arch_ring', { shape: 'parabolic', span: u(8, 'm'), rise: u(2, 'm'), thickness: u(0.4, 'm'), unit_weight: u(20, 'kN/m^3') }).radius)).toBe(true);
  });
});

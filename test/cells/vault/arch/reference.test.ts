// The kernel reference of the arch functions documents every option and every result field that the
// registrations declare (issue 12 §6: adding a field without documenting it fails a test).
import { describe, it, expect } from 'vitest';
import { arch_ring, arch_limit, thrust_line, arch_scan } from '../../../../cells/index.js';
import type { FieldType } from '../../../../cells/define.js';
import { ARCH_RING_REFERENCE, ARCH_LIMIT_REFERENCE, THRUST_LINE_REFERENCE, ARCH_SCAN_REFERENCE } from '../../../../cells/vault/arch/reference.js';

/** Dotted names of every field of a declared type (records and lists of records). */
function names(type: FieldType, prefix: string): string[] {
  if (typeof type === 'string' || 'ref' in type || 'refWithArgs' in type) return prefix ? [prefix] : [];
  if ('list' in type) return [...(prefix ? [prefix] : []), ...names(type.list, prefix).filter((n) => n !== prefix)];
  return [...(prefix ? [prefix] : []), ...Object.entries(type.object).flatMap(([k, t]) => names(t, prefix ? `${prefix}.${k}` : k))];
}

describe('kernel reference of the arch functions', () => {
  for (const [f, ref] of [[arch_ring, ARCH_RING_REFERENCE], [arch_limit, ARCH_LIMIT_REFERENCE], [thrust_line, THRUST_LINE_REFERENCE], [arch_scan, ARCH_SCAN_REFERENCE]] as const) {
    it(`${f.name}: every parameter and option, and every result field, has its text; method, assumptions and sources are given`, () => {
      for (const p of f.params) {
        for (const n of names(p.type, p.name)) expect(ref.params?.[n], `${f.name} param ${n}`).toBeTruthy();
      }
      const fields = typeof f.returns === 'object' && 'list' in f.returns ? names(f.returns.list, '') : names(f.returns, '');
      for (const n of fields) expect(ref.fields?.[n], `${f.name} field ${n}`).toBeTruthy();
      expect(ref.method!.length).toBeGreaterThan(40);
      expect(ref.assumptions!.length).toBeGreaterThan(0);
      expect(ref.sources!.length).toBeGreaterThan(0);
    });
  }

  it('the conventions are stated: origin of positions, angles, compression sign, gsf definition', () => {
    const all = JSON.stringify([ARCH_RING_REFERENCE, ARCH_LIMIT_REFERENCE, ARCH_SCAN_REFERENCE]);
    expect(all).toMatch(/from the left springing of the intrados/);
    expect(all).toMatch(/from the vertical: 0 at the crown, negative on the left half/);
    expect(all).toMatch(/compression positive/);
    expect(ARCH_LIMIT_REFERENCE.fields!.gsf_definition).toMatch(/loads as built/);
  });
});

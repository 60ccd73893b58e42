/**
 * archLimit for tests that read numbers: the same call, typed as if every
 * field were present as a number or list (the tests that expect Infinity or
 * "not available" say so with isNotAvailable / toBe(Infinity)).
 */
import { archLimit as kernel } from '../../../../cells/vault/arch/arch-limit.js';
import type { ArchLimit, Hinge } from '../../../../cells/vault/arch/types.js';

export type LooseLimit = Omit<ArchLimit, 'H_min' | 'H_max' | 'V_left' | 'V_right' | 't_min' | 'hinges' | 'load_factor' | 'mechanism' | 'sigma_max' | 'sigma_max_at'> & {
  H_min: number; H_max: number; V_left: number; V_right: number; t_min: number;
  hinges: Hinge[]; load_factor: number; mechanism: Hinge[]; sigma_max: number; sigma_max_at: number;
};

export const archLimit = (...args: Parameters<typeof kernel>): LooseLimit => kernel(...args) as unknown as LooseLimit;

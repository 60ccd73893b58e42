/**
 * The mathjs names a document may never use.
 */
import { DISABLED_FUNCTIONS, WITHHELD_NAMES } from '../../cells/math.js';

/**
 * Number types without a bound on their digits (`bigint(2)^bigint(1e9)` writes a billion
 * bits), and a solver whose step count has no bound; a calc computes with plain numbers.
 */
export const UNBOUNDED_FUNCTIONS = ['bignumber', 'bigint', 'fraction', 'solveODE'] as const;

/** Refused wherever they appear: they reach outside expressions or change the shared instance. */
export const NOT_FOR_DOCUMENTS: ReadonlySet<string> = new Set<string>([
  ...DISABLED_FUNCTIONS, ...WITHHELD_NAMES, ...UNBOUNDED_FUNCTIONS, 'import', 'create', 'factory', 'version',
]);

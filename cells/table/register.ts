/** Table helpers, registered for cells. */
import { defineCellFunction } from '../define.js';
import { interp as interpKernel } from './interp.js';
import { clamp as clampKernel } from './clamp.js';

export const interp = defineCellFunction({
  name: 'interp',
  doc: 'Linear interpolation in a table: interp(x, [x1, x2, …], [y1, y2, …]).',
  params: [{ name: 'x', type: 'any' }, { name: 'xs', type: { list: 'any' } }, { name: 'ys', type: { list: 'any' } }],
  returns: 'any',
  fn: interpKernel,
  reference: {
    params: {
      x: 'Where to read the table: a number or a quantity of the same dimension as xs.',
      xs: 'The table\'s abscissae, strictly increasing, at least two, all of one dimension.',
      ys: 'The ordinates, one per abscissa, all of one dimension (which may differ from x\'s).',
    },
    fields: { result: 'y at x, interpolated linearly between the two rows around x, in the dimension of ys. Outside [xs first, xs last] it refuses rather than extrapolate.' },
    method: 'Linear interpolation between the bracketing rows, with units.',
    assumptions: ['Extrapolating a code table is the engineer\'s decision, so it is refused.'],
    sources: ['None: arithmetic.'],
  },
});

export const clamp = defineCellFunction({
  name: 'clamp',
  doc: 'x limited to [lo, hi].',
  params: [{ name: 'x', type: 'any' }, { name: 'lo', type: 'any' }, { name: 'hi', type: 'any' }],
  returns: 'any',
  fn: clampKernel,
  reference: {
    params: {
      x: 'The value to limit: a number or a quantity.',
      lo: 'Lower limit, same dimension as x.',
      hi: 'Upper limit, same dimension as x, not below lo.',
    },
    fields: { result: 'lo when x < lo, hi when x > hi, otherwise x (with its own unit).' },
    method: 'Comparison, with units.',
    sources: ['None: arithmetic.'],
  },
});

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
});

export const clamp = defineCellFunction({
  name: 'clamp',
  doc: 'x limited to [lo, hi].',
  params: [{ name: 'x', type: 'any' }, { name: 'lo', type: 'any' }, { name: 'hi', type: 'any' }],
  returns: 'any',
  fn: clampKernel,
});

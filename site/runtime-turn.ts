/**
 * When the reactive runtime starts its turn on the page.
 *
 * @observablehq/runtime starts each turn on the next animation frame, which
 * suits animations; a live sheet wants an edit's results at once, so the
 * runtime's turn starts in a microtask right after the edit instead. The
 * runtime still orders the work and skips what does not depend on the
 * change; only the moment the turn starts moves, and the patch then lands in
 * the same task as the edit, before the next frame is drawn.
 *
 * `_computeSoon` is the runtime's own (writable) hook for this: its default
 * is `new Promise(requestAnimationFrame).then(() => this._computeNow())`.
 */
import { Runtime } from '@observablehq/runtime';

type Turn = { _disposed: boolean; _computeNow(): Promise<void> };

const proto = Runtime.prototype as unknown as { _computeSoon?: (this: Turn) => Promise<void> };
if (typeof proto._computeSoon !== 'function') {
  throw new TypeError('runtime-turn: @observablehq/runtime has no _computeSoon hook any more; review site/runtime-turn.ts');
}
proto._computeSoon = function computeSoon(this: Turn) {
  return Promise.resolve().then(() => (this._disposed ? undefined : this._computeNow()));
};

import { dome } from './cells/vault/dome/dome.js';
import { simplex } from './cells/vault/dome/simplex.js';
const d = dome({ radius: 10, half_angle: Math.PI / 2, thickness: 0.6, unit_weight: 2e4 });
// @ts-ignore
const mod = await import('./cells/vault/dome/dome-limit.js');
let t0 = performance.now();
for (let i = 0; i < 10; i++) mod.domeLimit(d);
console.log((performance.now() - t0) / 10);

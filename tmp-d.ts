import { dome } from './cells/vault/dome/dome.js';
import { domeLimit } from './cells/vault/dome/dome-limit.js';
const d = dome({ radius: 10, half_angle: Math.PI / 2, thickness: 0.6, unit_weight: 2e4 });
console.log(d, (d.phi_hoop_tension as number) * 180 / Math.PI);
let t0 = performance.now();
const L = domeLimit(d);
console.log({ ...L, thrust_min: undefined }, L.t_min / 10, performance.now() - t0);
const p = dome({ radius: 10, half_angle: Math.PI / 2, g: 1, p: 1 });
console.log((p.phi_hoop_tension as number) * 180 / Math.PI);

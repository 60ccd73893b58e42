/**
 * Every function a cell may call, one flat list. What is exported here is
 * what a document can use, and nothing else.
 */
export { interp, clamp } from './table/register.js';
export { groin_vault, web_membrane_at, vault_bays, cross_vault } from './vault/register-groin.js';
export { arch_ring, arch_limit, thrust_line, arch_scan } from './vault/register-arch.js';
export { buttress, tie, flying_buttress } from './supports/register.js';
export { barrel_membrane, membrane_at } from './vault/register-membrane.js';
export { dome, dome_at, dome_limit } from './vault/register-dome.js';
export { masonry_fk, masonry_fd, unit_weight } from './materials/register.js';
export { section, force_polygon, membrane_plot, vault_plan, support_figure, scan_plot, dome_figure, cross_vault_figure, flyer_figure } from './figures/register.js';

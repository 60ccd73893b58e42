/**
 * The public surface, asserted exactly: what a document can call (cells/index.ts) and
 * what the site and the CLI may import from the engine (engine/index.ts). A change here is
 * a change of the product's contract and should be deliberate.
 */
import { describe, it, expect } from 'vitest';
import * as cells from '../cells/index.js';
import * as engine from '../engine/index.js';
import * as render from '../engine/render/index.js';

describe('public surface', () => {
  it('cells/index.ts lists exactly the functions a cell may call', () => {
    expect(Object.keys(cells).sort()).toEqual([
      'arch_limit', 'arch_ring', 'arch_scan', 'barrel_membrane', 'buttress', 'clamp', 'cross_vault', 'cross_vault_figure', 'dome', 'dome_at', 'dome_figure', 'dome_limit',
      'flyer_figure', 'flying_buttress', 'force_polygon', 'groin_vault', 'interp', 'masonry_fd', 'masonry_fk', 'membrane_at', 'membrane_plot', 'scan_plot', 'section', 'support_figure',
      'thrust_line', 'tie', 'unit_weight', 'vault_bays', 'vault_plan', 'web_membrane_at',
    ]);
    for (const [key, f] of Object.entries(cells)) {
      expect(f.isCellFunction, key).toBe(true);
      expect(f.name, key).toBe(key);
      expect(f.doc.length, `${key} has a doc line`).toBeGreaterThan(10);
    }
  });

  it('engine/index.ts exports the stage entry points and formatters', () => {
    expect(Object.keys(engine).sort()).toEqual([
      'compile', 'documentUnitSystem', 'evaluateDocument', 'expandCases', 'formatDiagnostic', 'formatNumber', 'formatUtilization', 'formatValue', 'judgeCases', 'startSession', 'toJsonValue',
    ]);
  });

  // The sheet is its own entry so that eval and check do not load KaTeX and the sanitiser.
  it('engine/render/index.ts exports the sheet renderer', () => {
    expect(Object.keys(render).sort()).toEqual([
      'NEAR_LIMIT', 'SHEET_CSS', 'checkCasesNote', 'collectDiagnostics', 'makeRenderContext', 'renderArticle', 'renderCasesBlock', 'renderCellOutput',
      'renderCheckSummary', 'renderDiagnostics', 'renderSheet', 'renderStatus', 'sha256Hex', 'verdictOf', 'verdictOverCases',
    ]);
  });
});

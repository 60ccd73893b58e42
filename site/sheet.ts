/**
 * The one sheet renderer (engine/render/, the same code `vaultbook render`
 * runs), as the live page uses it. Nothing is rendered here; this file only
 * names the entry points the page needs.
 */
export {
  renderSheet, renderCellOutput, renderCheckSummary, renderCasesBlock, checkCasesNote, verdictOverCases, renderDiagnostics, renderStatus, makeRenderContext, SHEET_CSS,
  type RenderContext, type ArchiveInfo,
} from '../engine/render/index.js';

/**
 * The sheet renderer's public surface (pure: runs in Node and the browser).
 * A live page renders the sheet once with renderSheet({…, options: {standalone: false}}),
 * then patches `data-cell` elements with renderCellOutput and the `data-part`
 * elements with renderCheckSummary, renderDiagnostics and renderStatus.
 */
export { renderSheet, renderArticle, renderCellOutput, type SheetInput } from './sheet.js';
export { makeRenderContext, type RenderContext, type SheetOptions, type ArchiveInfo } from './context.js';
export { renderCheckSummary, verdictOf, NEAR_LIMIT, type Verdict } from './check.js';
export { renderDiagnostics, renderStatus, collectDiagnostics } from './diagnostics.js';
export { SHEET_CSS } from './sheet-css.js';
export { renderCasesBlock, checkCasesNote, verdictOverCases } from './cases.js';
export { sha256Hex } from './sha256.js';

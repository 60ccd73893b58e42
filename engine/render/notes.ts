/**
 * The fixed cautions every sheet carries, and the archive footer that ties
 * a printed sheet to the exact source it came from.
 */
import { escapeHtml } from './escape.js';
import type { ArchiveInfo } from './context.js';

/**
 * The scope and limits of the methods, in the same words on every sheet.
 * @param sigfigs significant figures the values are shown to
 */
export function renderCautions(sigfigs: number): string {
  return `<section class="vb-cautions" aria-label="Scope and limitations"><h2 class="vb-h">Scope and limitations</h2><ol>`
    + '<li><strong>Membrane analysis</strong> carries load by in-plane forces alone: it neglects bending in the shell and assumes the supports neither spread nor settle. Movements of the abutments and local bending near openings, point loads and edges must be considered separately.</li>'
    + '<li><strong>Limit analysis</strong> (the safe theorem) treats masonry as having no tensile strength and, unless the calc gives a compressive strength (<code>f_c</code>) or a coefficient of friction to the ring, unlimited compressive strength and joints that do not slide. Where they are not given, crushing of the masonry and sliding at joints and supports are not covered by a thrust-line result and are checked separately on this sheet where they matter.</li>'
    + `<li>Values are shown to ${sigfigs} significant figures; utilizations are rounded up to the next 0.01. A check is flagged ◆ when its utilization exceeds 0.95.</li>`
    + '<li>This calculation is a tool for a competent designer. It must be reviewed and approved by a suitably qualified engineer before it is relied on, and local building codes and licensed professional practice take precedence over anything it states.</li>'
    + '</ol></section>';
}

/**
 * The archive line: the source's SHA-256 and, when known, its commit and whether it had uncommitted changes.
 * @example renderArchive({hash: 'ab12…', commit: '9f3c…', dirty: false}, 'calc.md')
 */
export function renderArchive(archive: ArchiveInfo, file: string): string {
  const parts = [`source <code>${escapeHtml(file)}</code>`, `SHA-256 <code class="vb-hash">${escapeHtml(archive.hash)}</code>`];
  if (archive.commit) {
    parts.push(`commit <code>${escapeHtml(archive.commit.slice(0, 12))}</code>${archive.dirty ? ' <strong class="vb-dirty">with uncommitted changes</strong>' : ' (file unchanged since)'}`);
  } else if (archive.dirty !== undefined) {
    parts.push('not under version control');
  }
  return `<footer class="vb-archive" aria-label="Archive identification">${parts.join(' · ')}</footer>`;
}

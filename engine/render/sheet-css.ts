/**
 * The sheet's stylesheet, as a string so that Node and Vite import it alike.
 * Print first: A4, black-on-white, every verdict readable without colour
 * (a mark, a word and a border style for each), colour only as a second cue.
 */
export const SHEET_CSS = String.raw`
:root {
  --vb-ink: #1c2630; --vb-muted: #5b6773; --vb-rule: #9aa5b1; --vb-faint: #d9dee3; --vb-accent: #2c4a6b; --vb-tint: #f3f5f7;
  --vb-pass: #1f6b45; --vb-pass-bg: #e9f3ec; --vb-near: #7d5000; --vb-near-bg: #fbf0d6; --vb-fail: #a3162b; --vb-fail-bg: #fbe7e9;
  --vb-sans: "Liberation Sans", "DejaVu Sans", Arial, Helvetica, sans-serif;
  --vb-serif: "Liberation Serif", "DejaVu Serif", "Times New Roman", serif;
  --vb-mono: "DejaVu Sans Mono", "Liberation Mono", monospace;
}
html { background: #e6e9ec; }
body { margin: 0; color: var(--vb-ink); font: 10pt/1.42 var(--vb-sans); -webkit-print-color-adjust: exact; print-color-adjust: exact; }
.vb-sheet { box-sizing: border-box; max-width: 210mm; margin: 8mm auto; padding: 14mm 15mm 12mm 18mm; background: #fff; box-shadow: 0 1px 6px rgba(0,0,0,.18); }
@media print {
  html { background: none; }
  .vb-sheet { max-width: none; margin: 0; padding: 0; box-shadow: none; }
}
.vb-sheet a { color: inherit; text-decoration: none; border-bottom: 0.5pt dotted var(--vb-rule); }
.vb-sheet code, .vb-sheet pre { font-family: var(--vb-mono); font-size: 8.5pt; }
.vb-h { font-size: 10.5pt; text-transform: uppercase; letter-spacing: .06em; color: var(--vb-accent); margin: 5mm 0 2mm; padding-bottom: 1mm; border-bottom: 1.2pt solid var(--vb-accent); break-after: avoid; }
.vb-note { color: var(--vb-muted); font-size: 9pt; margin: 1mm 0; }
.vb-none { color: var(--vb-muted); }
.vb-num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.vb-unit { white-space: nowrap; }
.vb-rule { color: var(--vb-muted); font-size: 8pt; font-family: var(--vb-mono); }

/* Title block */
.vb-titleblock { border: 1.6pt solid var(--vb-ink); margin-bottom: 4mm; break-inside: avoid; }
.vb-tb-head { padding: 2.5mm 3mm 2mm; border-bottom: 1pt solid var(--vb-ink); background: var(--vb-tint); }
.vb-tb-kind { display: block; font-size: 7.5pt; letter-spacing: .14em; text-transform: uppercase; color: var(--vb-muted); }
.vb-tb-title { margin: .5mm 0 0; font-size: 15pt; line-height: 1.2; font-weight: bold; }
.vb-tb-grid { display: grid; grid-template-columns: repeat(4, 1fr); }
.vb-tb-cell { padding: 1.2mm 2.5mm 1.5mm; border-right: 0.5pt solid var(--vb-rule); border-bottom: 0.5pt solid var(--vb-rule); min-height: 8mm; }
.vb-tb-cell:nth-child(4n) { border-right: none; }
.vb-tb-span2 { grid-column: span 2; }
.vb-tb-wide { grid-column: 1 / -1; border-right: none; }
.vb-tb-label { display: block; font-size: 6.8pt; text-transform: uppercase; letter-spacing: .1em; color: var(--vb-muted); }
.vb-tb-value { display: block; font-size: 10pt; font-weight: bold; overflow-wrap: anywhere; }
.vb-tb-extra .vb-tb-value { font-weight: normal; }
.vb-tb-basis { margin: 0; padding: 0; list-style: none; display: flex; flex-wrap: wrap; gap: 0 6mm; font-size: 9pt; }
.vb-tb-basis li::before { content: "▪ "; color: var(--vb-accent); }

/* Banners */
.vb-banner { margin: 3mm 0; padding: 2.5mm 3mm; font-size: 9.5pt; break-inside: avoid; }
.vb-banner ul { margin: 1mm 0 0; padding-left: 5mm; }
.vb-banner--error { border: 2.4pt double var(--vb-fail); background: var(--vb-fail-bg); color: var(--vb-fail); }
.vb-banner--error strong { letter-spacing: .03em; }
.vb-banner--set { border: 1pt dashed var(--vb-near); background: var(--vb-near-bg); }

/* Checks summary */
.vb-overall { font-weight: bold; margin: 1mm 0 2mm; font-size: 10pt; }
.vb-overall--pass { color: var(--vb-pass); }
.vb-overall--fail { color: var(--vb-fail); text-transform: none; }
.vb-summary, .vb-inputs, .vb-fields { width: 100%; border-collapse: collapse; font-size: 9pt; }
.vb-summary th, .vb-inputs th { text-align: left; font-weight: normal; font-size: 7.5pt; text-transform: uppercase; letter-spacing: .08em; color: var(--vb-muted); border-bottom: 0.8pt solid var(--vb-ink); padding: 0.8mm 1.5mm; }
.vb-summary td, .vb-inputs td { border-bottom: 0.4pt solid var(--vb-faint); padding: 1mm 1.5mm; vertical-align: baseline; }
.vb-summary tr, .vb-inputs tr, .vb-fields tr { break-inside: avoid; }
.vb-summary th.vb-num { text-align: right; }
.vb-sum-verdict { white-space: nowrap; font-size: 8pt; letter-spacing: .03em; }
.vb-sum--pass .vb-sum-verdict { color: var(--vb-pass); }
.vb-sum--near td { background: var(--vb-near-bg); }
.vb-sum--near .vb-sum-verdict { color: var(--vb-near); font-weight: bold; }
.vb-near-note { margin-left: 1.5mm; font-size: 7.5pt; font-weight: normal; font-style: italic; }
.vb-sum--fail td { background: var(--vb-fail-bg); font-weight: bold; border-top: 1pt solid var(--vb-fail); border-bottom: 1pt solid var(--vb-fail); }
.vb-sum--fail .vb-sum-verdict { color: var(--vb-fail); }
.vb-sum--none .vb-sum-verdict { color: var(--vb-muted); font-style: italic; }
.vb-sum--off .vb-sum-verdict { color: var(--vb-muted); }
.vb-barcell { width: 24mm; }
.vb-bar { display: inline-block; position: relative; width: 22mm; height: 2.4mm; border: 0.5pt solid var(--vb-ink); vertical-align: middle; background: #fff; }
.vb-bar-fill { position: absolute; left: 0; top: 0; bottom: 0; background: #8d99a6; }
.vb-verdict--near .vb-bar-fill, .vb-sum--near .vb-bar-fill { background: repeating-linear-gradient(90deg, var(--vb-near) 0 1pt, #fff 1pt 2pt); }
.vb-verdict--fail .vb-bar-fill, .vb-sum--fail .vb-bar-fill { background: var(--vb-fail); }

/* Diagnostics */
.vb-diag-list { margin: 0; padding: 0; list-style: none; font-size: 9pt; }
.vb-diag-item { padding: 0.6mm 0; }
.vb-diag { margin: 1.2mm 0; padding: 1.2mm 2mm; font-size: 9pt; border-left: 2.4pt solid var(--vb-fail); background: var(--vb-fail-bg); break-inside: avoid; }
.vb-diag--warning { border-left-style: dashed; border-left-color: var(--vb-near); background: var(--vb-near-bg); }
.vb-diag--info { border-left-color: var(--vb-rule); background: var(--vb-tint); }
.vb-diag-mark { display: inline-block; width: 4mm; font-weight: bold; }
.vb-diag-word { font-weight: bold; font-size: 8pt; letter-spacing: .05em; }
.vb-diag-note { display: block; color: var(--vb-muted); padding-left: 4mm; }
.vb-diag--error .vb-diag-word, .vb-diag-item--error .vb-diag-word, .vb-diag-item--error .vb-diag-mark { color: var(--vb-fail); }
.vb-diag-item--warning .vb-diag-word, .vb-diag-item--warning .vb-diag-mark { color: var(--vb-near); }
.vb-blocked { margin: 1mm 0; font-size: 9pt; color: var(--vb-muted); font-style: italic; }

/* Cautions and archive */
.vb-cautions { font-size: 8pt; color: var(--vb-muted); break-inside: avoid; }
.vb-cautions .vb-h { font-size: 8.5pt; color: var(--vb-muted); border-bottom-width: 0.5pt; border-bottom-color: var(--vb-rule); margin-top: 4mm; }
.vb-cautions ol { margin: 0; padding-left: 5mm; }
.vb-cautions strong { color: var(--vb-ink); }
.vb-archive { break-before: avoid; margin-top: 8mm; padding-top: 1.5mm; border-top: 0.5pt solid var(--vb-rule); font-size: 7.5pt; color: var(--vb-muted); overflow-wrap: anywhere; break-inside: avoid; }
/* The last table of an appendix with the archive line after it: one unit, so the line never prints on a page alone. */
.vb-keep-end { break-inside: avoid; }
.vb-hash { font-size: 7pt; }
.vb-dirty { color: var(--vb-fail); }

/* Body: prose and blocks */
.vb-main { margin-top: 6mm; }
.vb-prose { font-family: var(--vb-serif); font-size: 10.5pt; }
.vb-prose h2, .vb-prose h3, .vb-prose h4 { font-family: var(--vb-sans); color: var(--vb-accent); break-after: avoid; }
.vb-prose h2 { font-size: 12.5pt; margin: 7mm 0 2mm; padding-bottom: 0.8mm; border-bottom: 0.8pt solid var(--vb-accent); }
.vb-prose h3 { font-size: 11pt; margin: 5mm 0 1.5mm; }
.vb-prose h4, .vb-prose h5, .vb-prose h6 { font-size: 10pt; margin: 4mm 0 1mm; }
.vb-prose p { margin: 1.5mm 0 2mm; }
/* No page starts or ends with a lone line of a paragraph or list item, or a lone table row. */
.vb-prose p, .vb-prose li, .vb-cautions li { orphans: 3; widows: 3; }
.vb-prose li:last-child, .vb-cautions li:last-child { break-before: avoid; }
.vb-summary tr:last-child, .vb-inputs tr:last-child, .vb-fields tr:last-child, .vb-prose tr:last-child { break-before: avoid; }
.vb-summary tbody tr:first-child, .vb-inputs tbody tr:first-child, .vb-prose tbody tr:first-child { break-after: avoid; }
.vb-prose table { border-collapse: collapse; font-family: var(--vb-sans); font-size: 9pt; }
.vb-prose th, .vb-prose td { border: 0.5pt solid var(--vb-rule); padding: 0.6mm 2mm; }
.vb-prose img { max-width: 100%; }
.vb-prose blockquote { margin: 2mm 0; padding-left: 3mm; border-left: 1.5pt solid var(--vb-faint); color: var(--vb-muted); }
.vb-display { text-align: center; margin: 2mm 0; }
.vb-block { margin: 2mm 0 3mm; }
.vb-ref { width: 9mm; color: var(--vb-muted); font-size: 7.5pt; font-family: var(--vb-mono); vertical-align: baseline; }
.vb-ref a { border-bottom: none; }
.vb-summary .vb-ref { white-space: nowrap; }
.vb-inputs .vb-sym { width: 16mm; white-space: nowrap; }
.vb-inputs .vb-q { width: 40mm; }
.vb-inputs .vb-range { width: 30mm; color: var(--vb-muted); font-size: 8.5pt; white-space: nowrap; }
.vb-value { font-weight: bold; font-variant-numeric: tabular-nums; }
.vb-set { display: inline-block; margin-left: 1.5mm; padding: 0 1mm; font-size: 7.5pt; font-weight: bold; border: 0.8pt dashed var(--vb-near); color: var(--vb-near); }
.vb-was { display: block; font-size: 7.5pt; color: var(--vb-muted); }
.vb-flag { display: block; font-size: 7.5pt; font-weight: bold; color: var(--vb-near); }
.vb-input--set td { background: var(--vb-near-bg); }

/* Steps of working: line | working | output */
.vb-step { display: grid; grid-template-columns: 9mm 1fr; border-bottom: 0.4pt solid var(--vb-faint); padding: 1.2mm 0; break-inside: avoid; }
.vb-step .vb-ref { padding-top: 0.8mm; }
.vb-desc { margin: 0 0 0.5mm; font-size: 9pt; color: var(--vb-muted); }
.vb-cellout { display: grid; grid-template-columns: minmax(0, 1fr) 50mm; column-gap: 3mm; align-items: center; }
.vb-work { min-width: 0; overflow-wrap: anywhere; }
/* Working rows: inline maths in display style, so a long row breaks at its operators; the name in the
   first column, every row's relation at the start of the second, continuation lines indented. */
.vb-rows { display: grid; grid-template-columns: minmax(0, 1fr); row-gap: 0.8mm; margin: 0.6mm 0; align-items: first baseline; }
.vb-rows--named { grid-template-columns: max-content minmax(0, 1fr); column-gap: 0.3em; }
.vb-lhs { text-align: right; }
.vb-rhs { min-width: 0; padding-left: 2.2em; text-indent: -2.2em; }
.vb-rhs .katex { text-indent: 0; }
.vb-rhs .katex .base { margin: 0.2em 0; }
.vb-out { min-width: 0; border-left: 0.8pt solid var(--vb-rule); padding-left: 2.5mm; align-self: stretch; display: flex; flex-direction: column; justify-content: center; overflow-wrap: anywhere; }
.vb-result { font-weight: bold; }
.vb-fields { table-layout: fixed; }
.vb-fields .vb-num { white-space: normal; overflow-wrap: anywhere; }
.vb-result .katex { font-size: 1.08em; }
.vb-call { margin: 0; font-size: 9pt; }
.vb-call code { font-weight: bold; color: var(--vb-accent); }
.vb-call-doc { color: var(--vb-muted); }
.vb-args { margin: 0.5mm 0 0; padding: 0; list-style: none; display: flex; flex-wrap: wrap; gap: 0.5mm 5mm; font-size: 9pt; }
.vb-recno { font-weight: bold; color: var(--vb-muted); }
.vb-key { color: var(--vb-muted); font-size: 8pt; }
.vb-kernel-notes { margin: 1mm 0 0; padding-left: 4mm; font-size: 8.5pt; color: var(--vb-near); }
.vb-fields caption { text-align: left; font-size: 7pt; text-transform: uppercase; letter-spacing: .08em; color: var(--vb-muted); }
.vb-fields td { padding: 0.2mm 1mm; border-bottom: 0.4pt solid var(--vb-faint); }
.vb-source { margin: 0; color: var(--vb-muted); white-space: pre-wrap; }
.vb-text { white-space: pre-wrap; overflow-wrap: anywhere; border: 0.5pt solid var(--vb-rule); padding: 1mm; }

/* Verdicts: mark + word + border style; colour is only a second cue */
.vb-verdict { padding: 1mm 2mm; border: 0.8pt solid var(--vb-pass); color: var(--vb-pass); background: var(--vb-pass-bg); font-size: 8.5pt; }
.vb-verdict .vb-mark { font-size: 12pt; font-weight: bold; margin-right: 1.5mm; }
.vb-verdict .vb-word { font-weight: bold; letter-spacing: .04em; }
.vb-verdict .vb-util { display: block; color: var(--vb-ink); font-variant-numeric: tabular-nums; margin: 0.5mm 0 0.8mm; }
.vb-verdict--near { border: 1.6pt dashed var(--vb-near); color: var(--vb-near); background: var(--vb-near-bg); }
.vb-verdict--fail { border: 3pt double var(--vb-fail); color: var(--vb-fail); background: var(--vb-fail-bg); }
.vb-verdict--fail .vb-word { text-decoration: underline; text-decoration-thickness: 1pt; }
.vb-verdict--none { border: 0.8pt dotted var(--vb-muted); color: var(--vb-muted); background: #fff; }
.vb-verdict--off { border: 0.8pt solid var(--vb-muted); color: var(--vb-muted); background: #fff; }
.vb-step--check { border-bottom-color: var(--vb-rule); }

/* Figures */
.vb-figure { display: grid; grid-template-columns: 9mm 1fr; margin: 3mm 0; break-inside: avoid; }
.vb-figbody { min-width: 0; }
.vb-figbody .vb-cellout { display: block; }
/* A figure prints at its own size, or scaled only to the column's width: its text stays at least 8 pt. */
.vb-svg svg { display: block; width: 100%; height: auto; max-width: 100%; }
.vb-figure figcaption { font-size: 8.5pt; color: var(--vb-muted); margin-top: 1mm; }
.vb-fignum { font-weight: bold; color: var(--vb-ink); }
.vb-figcall { margin-left: 2mm; font-size: 0.9em; }
`;

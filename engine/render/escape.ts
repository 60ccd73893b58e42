/**
 * Escaping for every context the sheet writes text into: HTML text and
 * attributes, CSS strings (the running header), TeX text and anchor ids.
 * Nothing from a document reaches the page without passing through one of these.
 */

const HTML: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Text safe to place between tags or inside a quoted attribute.
 * @example escapeHtml('<b a="1">') // "&lt;b a=&quot;1&quot;&gt;"
 */
export function escapeHtml(text: unknown): string {
  return String(text).replace(/[&<>"']/g, (c) => HTML[c]!);
}

/**
 * A CSS string literal (with its quotes) that cannot end the string, the rule or the style element.
 * @example cssString('Job "7" </style>') // "\"Job \\22 7\\22  \\3c /style\\3e \""
 */
export function cssString(text: string): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    // Quotes, backslash, angle brackets and control characters become hex escapes.
    if (ch === '"' || ch === '\\' || ch === '<' || ch === '>' || code < 0x20 || code === 0x7f) out += `\\${code.toString(16)} `;
    else out += ch;
  }
  return `"${out}"`;
}

const TEX_TEXT: Record<string, string> = {
  '\\': '\\textbackslash{}', '{': '\\{', '}': '\\}', $: '\\$', '&': '\\&', '#': '\\#', '^': '\\textasciicircum{}',
  _: '\\_', '%': '\\%', '~': '\\textasciitilde{}',
};

/**
 * Text for TeX's \text{…}: the special characters escaped.
 * @example texText('a_b {x}') // "a\\_b \\{x\\}"
 */
export function texText(text: string): string {
  return text.replace(/[\\{}$&#^_%~]/g, (c) => TEX_TEXT[c]!).replace(/[\u0000-\u001f]/g, ' ');
}

/**
 * The anchor id of a cell: letters, digits, '-' and '_' only.
 * @example anchorId('check@L30') // "cell-check-L30"
 */
export function anchorId(cellId: string): string {
  // Letters of any script stay (γ and λ must not share an anchor); HTML ids may hold them.
  return `cell-${cellId.replace(/[^\p{L}\p{N}_-]/gu, '-')}`;
}

/**
 * A cell's description as HTML: escaped, with text between backticks set as code, as in the prose.
 * @example descriptionHtml('the `a_1` length') // 'the <code>a_1</code> length'
 */
export function descriptionHtml(text: string): string {
  return escapeHtml(text).replace(/`([^`]+)`/g, '<code>$1</code>');
}

/**
 * Prose between cells: markdown rendered by marked, any raw HTML in it
 * cleaned by sanitize-html (no scripts, no event handlers, no javascript:
 * URLs, no styles, no remote images), and `$…$` / `$$…$$` typeset by KaTeX.
 * Maths is set aside as placeholders before sanitising, so KaTeX's own
 * markup never has to pass the sanitiser and nothing the author writes can
 * borrow its freedoms.
 */
import { Marked, type Tokens } from 'marked';
import { proseParts } from '../parse/blocks.js';
import { escapeHtml } from './escape.js';
import sanitizeHtml from 'sanitize-html';
import { typeset } from './katex.js';

const OPEN = '\uE000';
const CLOSE = '\uE001';

/** Tags a prose block may keep, with the few attributes each needs. */
const POLICY: sanitizeHtml.IOptions = {
  allowedTags: [
    'h1', 'h2', 'h3', 'h4', 'h5', 'h6', 'p', 'blockquote', 'ul', 'ol', 'li', 'dl', 'dt', 'dd', 'hr', 'br', 'pre', 'code',
    'a', 'em', 'strong', 'b', 'i', 'u', 's', 'del', 'sub', 'sup', 'small', 'mark', 'abbr', 'cite', 'q', 'kbd', 'var',
    'table', 'caption', 'thead', 'tbody', 'tfoot', 'tr', 'th', 'td', 'img', 'input', 'span', 'div', 'figure', 'figcaption',
  ],
  allowedAttributes: {
    a: ['href', 'title'],
    img: ['src', 'alt', 'title', 'width', 'height'],
    th: ['align', 'colspan', 'rowspan'],
    td: ['align', 'colspan', 'rowspan'],
    ol: ['start'],
    abbr: ['title'],
    code: ['class'],
    input: [{ name: 'type', multiple: false, values: ['checkbox'] }, 'checked', 'disabled'],
  },
  allowedClasses: { code: ['language-*'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  // Images only from data: URLs: viewing or printing a sheet must never fetch anything.
  allowedSchemesByTag: { img: ['data'] },
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
  // The sheet title is the only h1: prose headings move one level down.
  transformTags: { h1: 'h2', h2: 'h3', h3: 'h4', h4: 'h5', h5: 'h6' },
};

interface MathToken extends Tokens.Generic {
  type: 'vbMath';
  raw: string;
  tex: string;
  display: boolean;
}

/** Typeset maths of the block being rendered; the renderer leaves a numbered slot for each. */
let maths: string[] = [];

function mathSlot(token: Tokens.Generic): string {
  const t = token as MathToken;
  maths.push(typeset(t.tex, t.display));
  const slot = `${OPEN}${maths.length - 1}${CLOSE}`;
  return t.display ? `<div class="vb-display">${slot}</div>` : slot;
}

function renderer(): Marked {
  const marked = new Marked({ gfm: true, async: false });
  marked.use({
    extensions: [
      {
        name: 'vbMath',
        level: 'block',
        start: (src: string) => src.match(/^ {0,3}\$\$/m)?.index,
        tokenizer(src: string): MathToken | undefined {
          const m = /^ {0,3}\$\$([\s\S]+?)\$\$[ \t]*(?:\n+|$)/.exec(src);
          return m ? { type: 'vbMath', raw: m[0], tex: m[1]!.trim(), display: true } : undefined;
        },
        renderer: mathSlot,
      },
      {
        name: 'vbMath',
        level: 'inline',
        start: (src: string) => src.indexOf('$') >= 0 ? src.indexOf('$') : undefined,
        tokenizer(src: string): MathToken | undefined {
          const display = /^\$\$([^$`]+?)\$\$/.exec(src);
          if (display) return { type: 'vbMath', raw: display[0], tex: display[1]!.trim(), display: true };
          // `$x$` but not "costs $5 and $10": no space inside the dollars, no digit right after.
          // A backquote inside ends the attempt: code spans win over maths.
          const inline = /^\$(?![\s$])((?:\\.|[^\\$\n`])+?)(?<!\s)\$(?!\d)/.exec(src);
          return inline ? { type: 'vbMath', raw: inline[0], tex: inline[1]!, display: false } : undefined;
        },
      },
    ],
  });
  return marked;
}

let shared: Marked | null = null;

/**
 * A prose block as safe HTML.
 * @param markdown the block's text
 * @returns HTML with raw HTML sanitised and maths typeset
 * @example renderProse('The span $L$ is <b>6 m</b><script>x()</script>.') // '<p>The span <span class="katex">…</span> is <b>6 m</b>.</p>'
 */
export function renderProse(markdown: string): string {
  const parts = proseParts(markdown);
  if (parts.length !== 1 || !('markdown' in parts[0]!)) {
    return parts.map((p) => ('markdown' in p ? renderProse(p.markdown) : `<p class="vb-plain">${escapeHtml(p.plain)}</p>`)).join('\n');
  }
  shared ??= renderer();
  maths = [];
  // Placeholders never come from the author: drop any such characters first.
  const clean = parts[0].markdown.replace(/[\uE000\uE001]/g, '');
  const html = shared.parse(clean, { async: false }) as string;
  const safe = sanitizeHtml(html, POLICY);
  // Put the maths back only in text, never inside a tag or an attribute.
  return safe.split(/(<[^>]*>)/).map((part) => (part.startsWith('<')
    ? part.replace(/[\uE000\uE001]\d*/g, '')
    : part.replace(new RegExp(`${OPEN}(\\d+)${CLOSE}`, 'g'), (_, i: string) => maths[Number(i)] ?? ''))).join('');
}

/**
 * The one place KaTeX is called: fixed options, so every sheet typesets alike
 * and nothing a document writes can reach a URL or an HTML attribute.
 */
import katex from 'katex';

const OPTIONS = {
  throwOnError: false,
  trust: false,
  strict: 'ignore' as const,
  output: 'htmlAndMathml' as const,
  maxExpand: 500,
  maxSize: 20,
};

const cache = new Map<string, string>();
const CACHE_LIMIT = 2000;

/**
 * TeX → KaTeX HTML (with MathML for screen readers).
 * @param tex the formula
 * @param display true for a display block, false inline
 * @example typeset('\\frac{a}{b}', false) // '<span class="katex">…'
 */
export function typeset(tex: string, display = false): string {
  const key = `${display ? 'D' : 'I'}${tex}`;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const html = katex.renderToString(tex, { ...OPTIONS, displayMode: display });
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  cache.set(key, html);
  return html;
}

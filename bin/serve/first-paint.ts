/**
 * The sheet as the page will first show it, rendered by the server: written
 * into the page itself (built-site.ts), so the browser paints it before the
 * page's script has even run; the page replaces it with its own live sheet
 * (the same HTML, from the same renderer) once it has evaluated the document.
 * The server starts this render as soon as it listens.
 */
import { compile, startSession } from '../../engine/index.js';
import { findCase } from '../../engine/cases/index.js';
import { renderSheet, SHEET_CSS } from '../../engine/render/index.js';
import { archiveInfo } from '../commands/render.js';
import { versionOf } from './version.js';
import { readDocumentBytesSync } from '../document.js';

export interface FirstPaint {
  /** The sheet (<article>) of the file as it is now, with its version; its images point at /__asset/. */
  get(): Promise<{ version: string; html: string }>;
  /** The sheet's style sheet (the page adds the same one). */
  css: string;
}

/**
 * Points the sheet's images at the server's /__asset/ route, as the page does (site/main.ts
 * pointAssets): a relative src is a file beside the document.
 * @example pointAssets('<img src="./fig.png">') // '<img src="/__asset/fig.png">'
 */
export function pointAssets(html: string): string {
  return html.replace(/(<img\b[^>]*?\ssrc=")([^"]*)"/g, (all, head: string, src: string) =>
    (/^([a-z][a-z0-9+.-]*:|\/|#)/i.test(src) ? all : `${head}/__asset/${src.replace(/^\.\//, '')}"`));
}

/**
 * @param file the document's real path
 * @param caseName `serve --case NAME`: the first paint shows that case's values, as the live sheet will
 *   (a name the document does not have is painted as written; the live sheet reports it)
 * @example const first = firstPaint(file); const {html} = await first.get();
 */
export function firstPaint(file: string, shownName: string, caseName?: string): FirstPaint {
  let last: { version: string; result: Promise<{ version: string; html: string }> } | null = null;
  const render = async (bytes: Buffer, version: string) => {
    const text = bytes.toString('utf8');
    let doc = compile(text, { file: shownName });
    let session = startSession(doc);
    if (caseName !== undefined) {
      const shown = await findCase(doc, session, caseName);
      if ('case' in shown) {
        session.dispose();
        doc = compile(text, { file: shownName, overrides: shown.case.overrides });
        session = startSession(doc);
      }
    }
    const [states, archive] = await Promise.all([session.settle(), archiveInfo(file, bytes)]);
    const html = renderSheet({ doc, states, warnings: session.warnings, options: { standalone: false, archive } });
    session.dispose();
    return { version, html: pointAssets(html) };
  };
  const get = () => {
    let bytes: Buffer;
    try {
      bytes = readDocumentBytesSync(file);
    } catch (e) {
      return Promise.reject(e as Error); // never a throw: callers answer a request with the failure
    }
    const version = versionOf(bytes);
    if (last?.version !== version) last = { version, result: render(bytes, version) };
    return last.result;
  };
  return { get, css: SHEET_CSS };
}

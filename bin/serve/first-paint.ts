/**
 * The sheet as the page will first show it, rendered by the server: the page
 * paints it at once and replaces it with its own live sheet (the same HTML,
 * from the same renderer) once it has evaluated the document. The server
 * starts this render when it starts, so it is ready by the time a browser asks.
 */
import { readFileSync } from 'node:fs';
import { compile, startSession } from '../../engine/index.js';
import { renderSheet } from '../../engine/render/index.js';
import { archiveInfo } from '../commands/render.js';
import { versionOf } from './version.js';

export interface FirstPaint {
  /** The sheet (<article>) of the file as it is now, with its version. */
  get(): Promise<{ version: string; html: string }>;
}

/**
 * @param file the document's real path
 * @example const first = firstPaint(file); const {html} = await first.get();
 */
export function firstPaint(file: string, shownName: string): FirstPaint {
  let last: { version: string; result: Promise<{ version: string; html: string }> } | null = null;
  const render = async (bytes: Buffer, version: string) => {
    const doc = compile(bytes.toString('utf8'), { file: shownName });
    const session = startSession(doc);
    const [states, archive] = await Promise.all([session.settle(), archiveInfo(file, bytes)]);
    const html = renderSheet({ doc, states, warnings: session.warnings, options: { standalone: false, archive } });
    session.dispose();
    return { version, html };
  };
  const get = () => {
    const bytes = readFileSync(file);
    const version = versionOf(bytes);
    if (last?.version !== version) last = { version, result: render(bytes, version) };
    return last.result;
  };
  return { get };
}

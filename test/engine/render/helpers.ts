/** Compile, evaluate and render a document in one call, for the renderer tests. */
import { compile, startSession, type CompiledDocument, type CellState, type Diagnostic } from '../../../engine/index.js';
import { renderSheet, makeRenderContext, type SheetOptions, type RenderContext } from '../../../engine/render/index.js';

export interface Rendered {
  html: string;
  doc: CompiledDocument;
  states: Map<string, CellState>;
  warnings: Map<string, Diagnostic>;
  ctx: RenderContext;
}

export async function renderText(source: string, opts: { file?: string; overrides?: Record<string, string>; options?: SheetOptions } = {}): Promise<Rendered> {
  const doc = compile(source, { file: opts.file ?? 'test.md', overrides: opts.overrides ?? {} });
  const session = startSession(doc);
  const states = await session.settle();
  const warnings = new Map(session.warnings);
  session.dispose();
  const options = { standalone: false, ...opts.options };
  const html = renderSheet({ doc, states, warnings, options });
  return { html, doc, states, warnings, ctx: makeRenderContext(doc, states, warnings, options) };
}

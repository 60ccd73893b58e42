/**
 * Timing of `vaultbook render` on the largest template (or the largest sheet
 * fixture when there are no templates): cold (a fresh `node bin/vaultbook.js
 * render` process, wall time, beside the bare start-up of `--help` for
 * comparison) and warm (in-process medians of evaluate + render and of the
 * render alone), and the size of the standalone HTML.
 * Targets (printed, not asserted): cold ≤ 1 s wall, HTML ≤ 1.5 MB.
 */
import { performance } from 'node:perf_hooks';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { compile, startSession } from '../../engine/index.js';
import { renderSheet } from '../../engine/render/index.js';
import { loadKatexCss } from '../../bin/commands/render.js';

const root = fileURLToPath(new URL('../../', import.meta.url));

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** The largest .md file of the templates, else of the sheet fixtures. */
function largestDocument(): string {
  for (const dir of [join(root, 'templates'), join(root, 'test/fixtures/sheets')]) {
    if (!existsSync(dir)) continue;
    const files = readdirSync(dir).filter((f) => f.endsWith('.md')).map((f) => join(dir, f));
    if (files.length) return files.sort((a, b) => statSync(b).size - statSync(a).size)[0]!;
  }
  throw new Error('render.bench: no document to render');
}

function wall(args: string[]): number {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, [join(root, 'bin/vaultbook.js'), ...args], { cwd: root, encoding: 'utf8' });
  const ms = performance.now() - t0;
  if (r.status === null || r.status > 2) throw new Error(`render.bench: ${args.join(' ')} failed: ${r.stderr}`);
  return ms;
}

export async function run(): Promise<string[]> {
  const file = largestDocument();
  const name = file.slice(root.length);
  const scratch = mkdtempSync(join(tmpdir(), 'vb-bench-'));
  const out = join(scratch, 'sheet.html');
  try {
    wall(['render', file, '-o', out]); // first run builds the bundle if needed and writes its code cache
    const cold = [0, 1, 2, 3, 4].map(() => wall(['render', file, '-o', out]));
    const startup = [0, 1, 2].map(() => wall(['--help']));
    const bytes = statSync(out).size;
    const source = readFileSync(file, 'utf8');
    const katexCss = loadKatexCss();
    const full: number[] = [];
    const renderOnly: number[] = [];
    for (let i = 0; i < 7; i++) {
      const t0 = performance.now();
      const doc = compile(source, { file: name });
      const session = startSession(doc);
      const states = await session.settle();
      const t1 = performance.now();
      renderSheet({ doc, states, warnings: session.warnings, options: { standalone: true, katexCss } });
      const t2 = performance.now();
      session.dispose();
      if (i > 0) { full.push(t2 - t0); renderOnly.push(t2 - t1); }
    }
    const ok = (v: boolean) => (v ? 'within target' : 'OVER target');
    return [
      `render ${name}: cold process ${median(cold).toFixed(0)} ms wall (median of 5; min ${Math.min(...cold).toFixed(0)} ms) — ${ok(median(cold) <= 1000)} of 1000 ms`,
      `render: bare CLI start-up (--help) ${median(startup).toFixed(0)} ms wall, so the render itself adds ${(median(cold) - median(startup)).toFixed(0)} ms`,
      `render ${name}: warm in-process evaluate + render ${median(full).toFixed(0)} ms, render alone ${median(renderOnly).toFixed(0)} ms (medians of 6)`,
      `render ${name}: standalone HTML ${(bytes / 1024 / 1024).toFixed(2)} MB — ${ok(bytes <= 1.5 * 1024 * 1024)} of 1.5 MB`,
    ];
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

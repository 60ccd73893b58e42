/**
 * Sheet fixtures: test/fixtures/sheets/<case>.md next to <case>.html (the
 * sheet's <article>, as a live page embeds it). Adding a case is adding the
 * two files; UPDATE_FIXTURES=1 writes the .html files afresh. The templates
 * are rendered too and must come out without errors.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { parse } from 'node-html-parser';
import { renderText } from './helpers.js';

const dir = fileURLToPath(new URL('../../fixtures/sheets/', import.meta.url));
const templates = fileURLToPath(new URL('../../../templates/', import.meta.url));
const cases = readdirSync(dir).filter((f) => f.endsWith('.md')).map((f) => f.slice(0, -3)).sort();
const update = process.env.UPDATE_FIXTURES === '1';

describe('sheet fixtures', () => {
  it('there are fixture cases', () => {
    expect(cases.length).toBeGreaterThanOrEqual(5);
  });

  for (const name of cases) {
    it(`renderSheet(${name}.md) matches ${name}.html`, async () => {
      const source = readFileSync(join(dir, `${name}.md`), 'utf8');
      const { html } = await renderText(source, { file: `${name}.md` });
      const expectedPath = join(dir, `${name}.html`);
      if (update || !existsSync(expectedPath)) writeFileSync(expectedPath, `${html}\n`);
      expect(`${html}\n`).toBe(readFileSync(expectedPath, 'utf8'));
    });
  }
});

describe('templates render as sheets', () => {
  const names = existsSync(templates) ? readdirSync(templates).filter((f) => f.endsWith('.md')).sort() : [];
  for (const file of names) {
    it(`renderSheet(templates/${file}) has no errors, typeset working and a verdict for every check`, async () => {
      const r = await renderText(readFileSync(join(templates, file), 'utf8'), { file });
      const root = parse(r.html);
      expect(root.querySelector('.vb-banner--error'), 'error banner').toBeNull();
      expect(root.querySelectorAll('.vb-main .katex').length).toBeGreaterThan(10);
      const checks = r.doc.graph.cells.filter((c) => c.kind === 'check');
      expect(checks.length).toBeGreaterThan(0);
      for (const c of checks) {
        const region = root.querySelectorAll('[data-cell]').find((e) => e.getAttribute('data-cell') === c.id)!;
        expect(region.querySelector('.vb-verdict--pass, .vb-verdict--near, .vb-verdict--fail'), c.id).not.toBeNull();
      }
      expect(root.querySelector('.vb-titleblock h1')!.text.length).toBeGreaterThan(0);
    });
  }
});

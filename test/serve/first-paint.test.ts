/**
 * The server's first paint of `serve --case NAME` shows that case's values, as the live sheet will
 * (before, it painted the document as written until the page took over: a reviewer saw the
 * characteristic thrust under the name of the design case). The values are compared with
 * evaluateDocument's own run of the case, a separate path through the engine.
 */
import { copyFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { firstPaint } from '../../bin/serve/first-paint.js';
import { evaluateDocument } from '../../engine/index.js';

const dir = mkdtempSync(join(tmpdir(), 'vaultbook-first-paint-'));
const file = join(dir, 'barrel-vault.md');
copyFileSync(new URL('../../templates/barrel-vault.md', import.meta.url), file);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The text of T_d's value as the sheet prints it: the KaTeX-free value span after its name. */
const shownText = async (caseName?: string) => {
  const source = readFileSync(file, 'utf8');
  const { summary } = await evaluateDocument(source, { file: 'barrel-vault.md', ...(caseName ? { case: caseName } : {}) });
  return summary.values['T_d']!.text;
};

describe('firstPaint', () => {
  it('firstPaint(file, name, "STR") paints the STR case\'s thrust, not the document as written', async () => {
    const [asWritten, str] = await Promise.all([shownText(), shownText('STR')]);
    expect(str).not.toBe(asWritten); // the case moves T_d, or this test proves nothing
    const painted = (await firstPaint(file, 'barrel-vault.md', 'STR').get()).html;
    const plain = (await firstPaint(file, 'barrel-vault.md').get()).html;
    const number = (t: string) => t.split(' ')[0]!;
    expect(painted).toContain(number(str));
    expect(plain).toContain(number(asWritten));
    expect(painted).not.toBe(plain);
  });
});

/**
 * Fixture pairs: test/fixtures/diagnostics/<case>.md and <case>.json listing the
 * expected diagnostics (rule, line, column, cell, severity). Adding a case is adding two files.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { evaluateDocument } from '../../engine/index.js';

const dir = join(import.meta.dirname, '../fixtures/diagnostics');
const cases = readdirSync(dir).filter((f) => f.endsWith('.md')).map((f) => f.slice(0, -3));

describe('diagnostics fixtures', () => {
  it('has cases', () => expect(cases.length).toBeGreaterThan(0));
  for (const name of cases) {
    it(`${name}.md gives the diagnostics in ${name}.json`, async () => {
      const text = readFileSync(join(dir, `${name}.md`), 'utf8');
      const expected = JSON.parse(readFileSync(join(dir, `${name}.json`), 'utf8'));
      const { summary } = await evaluateDocument(text, { file: `${name}.md` });
      const got = summary.diagnostics.map((d) => ({ ruleId: d.ruleId, line: d.line, column: d.column, cellId: d.cellId, severity: d.severity }));
      expect(got).toEqual(expected);
    });
  }
});

/**
 * A complex result is an error on its line, never a crash of the whole document; mathjs's messages
 * about calls (max(), log(L), L ^ L, L[1]) and kernel limits are said in the calc's words and units.
 */
import { describe, it, expect } from 'vitest';
import { evaluateDocument } from '../../engine/index.js';

const doc = (calc: string, check = ''): string =>
  `---\ntitle: fictional\n---\n\`\`\`given\nL = 6 m\nx = 4 m^2\n\`\`\`\n\n\`\`\`calc\n${calc}\n\`\`\`\n${check ? `\n\`\`\`check\n${check}\n\`\`\`\n` : ''}`;

async function errorsOf(text: string): Promise<string[]> {
  const { summary } = await evaluateDocument(text, { file: 'x.md' });
  return summary.diagnostics.filter((d) => d.severity === 'error').map((d) => d.message);
}

describe('complex results', () => {
  it('sqrt of a negative quantity is an error on its line and the other lines still evaluate', async () => {
    const { summary } = await evaluateDocument(doc('b = sqrt(x - 5 m^2)\nd = 2 * x'), { file: 'x.md' });
    const errors = summary.diagnostics.filter((d) => d.severity === 'error');
    expect(errors.map((d) => d.line)).toEqual([10]);
    expect(errors[0]!.message).toMatch(/complex number: the square root of a negative value/);
    expect(summary.values['d']?.text).toBe('8 m^2');
  });

  it('a check on a complex demand has no verdict and says why in plain words', async () => {
    const errors = await errorsOf(doc('d = 1', 'sqrt(x - 5 m^2) <= 1 m'));
    expect(errors).toEqual(['cannot compare a complex number: a square root, power or logarithm of a negative value in this line']);
  });
});

describe('calls said in the calc\'s words', () => {
  it.each([
    ['s = max()', 'max(…) needs at least one argument'],
    ['s = log(L)', 'log(…) takes a plain number, not length (m); divide by a unit first (e.g. L / (1 m))'],
    ['s = L ^ L', 'a power takes a plain number as exponent, not length (m), in "L ^ L"'],
    ['s = L[1]', 'cannot take an item [n] of this value: it is a single value or a record, not a list'],
  ])('%s', async (line, message) => {
    expect(await errorsOf(doc(line))).toEqual([message]);
  });
});

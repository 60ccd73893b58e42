/** The plain text table of eval, check and explain (layout only; common practice for terminal tables). */
import { describe, it, expect } from 'vitest';
import { table } from '../../bin/table.js';

describe('table', () => {
  it('table rules its last column no wider than a terminal line, however long a value: eval of a kernel record drew a rule of 5,000 characters', () => {
    const long = `{${'x: 1 m, '.repeat(600)}}`;
    const lines = table(['line', 'kind', 'name', 'value'], [['46', 'calc', 'bay', long], ['47', 'calc', 'z', '0 m']]).split('\n');
    expect(lines[1]!.length).toBeLessThanOrEqual(80);
    expect(lines[1]).toBe(`────  ────  ────  ${'─'.repeat(80 - 18)}`);
    expect(lines[2]).toBe(`46    calc  bay   ${long}`); // the value itself is printed whole
  });

  it('table rules a short last column to its longest value', () => {
    expect(table(['name', 'value'], [['a', '12 kN']]).split('\n')[1]).toBe('────  ─────');
  });
});

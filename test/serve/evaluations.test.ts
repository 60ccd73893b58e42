import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { compile, startSession } from '../../engine/index.js';
import type { CompiledDocument } from '../../engine/index.js';
import { FIXTURES } from './helpers.js';

const TEXT = readFileSync(join(FIXTURES, 'barrel.md'), 'utf8');

/** The input and every cell that reads it, directly or through others. */
function dependentsOf(doc: CompiledDocument, name: string): Set<string> {
  const out = new Set([name]);
  for (let grew = true; grew;) {
    grew = false;
    for (const c of doc.graph.cells) {
      if (!out.has(c.id) && c.uses.some((u) => out.has(u))) { out.add(c.id); grew = true; }
    }
  }
  return out;
}

describe('Session.setInput on the live sheet', () => {
  it('each edit evaluates exactly the edited input and its dependents, once each', async () => {
    const doc = compile(TEXT, { file: 'barrel.md' });
    const session = startSession(doc);
    await session.settle();
    const inputs = doc.graph.cells.filter((c) => c.kind === 'given').map((c) => c.name!);
    expect(inputs.length).toBeGreaterThan(5);
    for (const [i, name] of inputs.entries()) {
      const before = new Map(session.evaluations);
      expect(session.states.get(name)!.status).toBe('ok');
      // A few per cent more than the document's value, keeping its unit: a real change each time.
      const text = `(${doc.graph.byId.get(name)!.source}) * ${1.03 + i / 1000}`;
      expect(session.setInput(name, text)).toBeNull();
      await session.settle();
      const ran = [...session.evaluations].filter(([id, n]) => n !== (before.get(id) ?? 0)).map(([id, n]) => [id, n - (before.get(id) ?? 0)]);
      const expected = dependentsOf(doc, name);
      expect(new Set(ran.map(([id]) => id)), `edit of ${name}`).toEqual(expected);
      for (const [, n] of ran) expect(n, `edit of ${name}`).toBe(1);
    }
    session.dispose();
  });
});

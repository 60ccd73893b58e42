import { describe, it, expect } from 'vitest';
import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { main } from '../../bin/cli.js';
import { FIXTURES } from './helpers.js';

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '', err = '';
  const code = await main(args, (s) => { out += `${s}\n`; }, (s) => { err += `${s}\n`; });
  return { code, out, err };
}

describe('vaultbook serve (command line)', () => {
  it('serve refuses a missing FILE, a file that does not exist and a bad --port, with exit 2', async () => {
    expect(await run(['serve'])).toMatchObject({ code: 2, err: expect.stringMatching(/serve takes exactly one FILE/) });
    expect(await run(['serve', 'no-such-calc.md'])).toMatchObject({ code: 2, err: expect.stringMatching(/no-such-calc\.md:1:1 {2}error: cannot read no-such-calc\.md: no such file/) });
    expect(await run(['serve', 'package.json', '--port', 'eighty'])).toMatchObject({ code: 2, err: expect.stringMatching(/--port expects a number/) });
    expect(await run(['serve', 'package.json', '--port', '70000'])).toMatchObject({ code: 2 });
  });

  it('serve --port N on a port another program holds exits 2 with a plain message, no stack trace', { timeout: 60_000 }, async () => {
    const holder = createServer();
    await new Promise<void>((ok) => holder.listen(0, '127.0.0.1', ok));
    try {
      const port = (holder.address() as AddressInfo).port;
      const r = await run(['serve', join(FIXTURES, 'barrel.md'), '--port', String(port)]);
      expect(r).toMatchObject({ code: 2, err: `vaultbook serve: port ${port} on 127.0.0.1 is taken by another program; choose another with --port, or --port 0 for any free one\n` });
    } finally {
      holder.close();
    }
  });

  it('the usage lists serve', async () => {
    expect((await run(['--help'])).out).toMatch(/vaultbook serve FILE \[--port N\]/);
  });
});

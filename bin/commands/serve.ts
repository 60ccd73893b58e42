/**
 * `vaultbook serve FILE [--port N]`: the live sheet, on 127.0.0.1 only.
 */
import { formatDiagnostic } from '../../engine/index.js';
import { parse, CASE_OPTION, UsageError } from '../args.js';
import { DocumentError, readDocument } from '../document.js';
import { startServer } from '../serve/server.js';

/** Resolves when the process is asked to stop (Ctrl-C or SIGTERM). */
function untilStopped(): Promise<string> {
  return new Promise((ok) => {
    process.once('SIGINT', () => ok('SIGINT'));
    process.once('SIGTERM', () => ok('SIGTERM'));
  });
}

export async function serveCommand(args: string[], out: (s: string) => void, err: (s: string) => void = (s) => process.stderr.write(`${s}\n`)): Promise<number> {
  const { values, positionals } = parse(args, { ...CASE_OPTION, port: { type: 'string', short: 'p' } });
  if (positionals.length !== 1) throw new UsageError('serve takes exactly one FILE');
  const file = positionals[0]!;
  let port: number | undefined;
  if (values.port !== undefined) {
    port = Number(values.port);
    if (!Number.isInteger(port) || port < 0 || port > 65535) throw new UsageError(`--port expects a number 0–65535, got "${values.port}"`);
  }
  try {
    await readDocument(file);
  } catch (e) {
    if (!(e instanceof DocumentError)) throw e;
    err(formatDiagnostic(e.toDiagnostic()));
    return 2;
  }
  let server;
  try {
    server = await startServer({ file, port, strictPort: port !== undefined && port !== 0, ...(values.case !== undefined ? { case: values.case as string } : {}) });
  } catch (e) {
    if (e instanceof DocumentError) { err(formatDiagnostic(e.toDiagnostic())); return 2; }
    const code = (e as NodeJS.ErrnoException).code;
    if (code !== 'EADDRINUSE' && !/already in use/i.test((e as Error).message)) throw e;
    err(`vaultbook serve: port ${port} on 127.0.0.1 is taken by another program; choose another with --port, or --port 0 for any free one`);
    return 2;
  }
  out(`vaultbook serve: ${file} at ${server.url}  (127.0.0.1 only; Ctrl-C stops)`);
  // The launcher (bin/vaultbook.js) writes the command's code cache then, holding what a start runs.
  void server.rendered.then(() => (process as NodeJS.EventEmitter).emit('vaultbook:started'));
  await untilStopped();
  await server.close();
  return 0;
}

/**
 * `vaultbook help [NAME]`: the commands and the kernel functions; for one kernel function its
 * reference (arguments, result fields, method, assumptions, sources), the text docs/kernel.md holds.
 */
import { cellFunctions } from '../../engine/library.js';
import { suggestName } from '../../engine/graph/suggest.js';
import { UsageError } from '../args.js';
import { functionList, referenceText } from '../reference.js';

/**
 * Prints the help for a command line.
 * @param usage the command list (cli.ts passes its own, so this file does not import it back)
 */
export async function helpCommand(args: string[], out: (s: string) => void, usage: () => string, commands: Record<string, { usage: string }>): Promise<number> {
  if (args.length > 1) throw new UsageError('help takes at most one NAME');
  const name = args[0];
  if (name === undefined) {
    out(`${usage()}\n\nKernel functions a cell may call (vaultbook help NAME for one; all in docs/kernel.md):\n${functionList([...cellFunctions.values()])}`);
    return 0;
  }
  const fn = cellFunctions.get(name);
  if (fn) {
    out(referenceText(fn));
    return 0;
  }
  const command = commands[name];
  if (command) {
    out(`usage: vaultbook ${command.usage}`);
    return 0;
  }
  const guess = suggestName(name, [...cellFunctions.keys(), ...Object.keys(commands)]);
  throw new UsageError(`no kernel function or command "${name}"${guess ? `; did you mean "${guess}"?` : ''} (vaultbook help lists them)`);
}

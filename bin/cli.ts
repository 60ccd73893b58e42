/**
 * The `vaultbook` command: eval, check (and more as they land).
 */
import { UsageError } from './args.js';

type Command = (args: string[], out: (s: string) => void, err: (s: string) => void) => Promise<number>;

export const COMMANDS: Record<string, { run: Command; usage: string }> = {
  // Every command is loaded when it runs, so `--help` or a mistyped command answers without
  // loading the engine (mathjs alone takes about 0.1 s to set up).
  eval: { run: (a, o) => import('./commands/eval.js').then((m) => m.evalCommand(a, o)), usage: 'eval FILE [--set NAME=EXPR ...] [--case NAME] [--json]  evaluate a calc and list its values' },
  check: { run: (a, o) => import('./commands/check.js').then((m) => m.checkCommand(a, o)), usage: 'check FILE|GLOB... [--set NAME=EXPR ...] [--case NAME] [--json] [--jobs N]  evaluate and judge every check in every case (exit 0 all hold, 1 a check fails, 2 errors)' },
  new: { run: (a, o, e) => import('./commands/new.js').then((m) => m.newCommand(a, o, e)), usage: 'new [TEMPLATE FILE]                          start a calc from a template (lists templates without one; never overwrites)' },
  diff: { run: (a, o, e) => import('./commands/diff.js').then((m) => m.diffCommand(a, o, e)), usage: 'diff OLD NEW | diff FILE --rev REV [--json]  what changed: inputs, results (%), checks flipped (exit 1 when a check newly fails)' },
  render: { run: (a, o, e) => import('./commands/render.js').then((m) => m.renderCommand(a, o, e)), usage: 'render FILE [-o OUT.html|-] [--pdf OUT.pdf] [--set NAME=EXPR ...] [--case NAME] [--drivers]  the printable sheet: self-contained HTML (default <name>.html beside FILE), PDF by Chromium; --drivers adds the appendix "what drives each check"' },
  explain: { run: (a, o) => import('./commands/explain.js').then((m) => m.explainCommand(a, o)), usage: 'explain FILE [CHECK ...] [--set NAME=EXPR ...] [--case NAME] [--json] [--jobs N]  what drives each check: its inputs ranked by the swing at ±10 %, with elasticities' },
  serve: { run: async (a, o, e) => (await import('./commands/serve.js')).serveCommand(a, o, e), usage: 'serve FILE [--port N] [--case NAME]             the live sheet in a browser: edit inputs, review changes, write them back' },
  help: { run: (a, o) => import('./commands/help.js').then((m) => m.helpCommand(a, o, usage, COMMANDS)), usage: 'help [FUNCTION|COMMAND]                       the kernel functions; one function\'s arguments, result fields, method and sources' },
};

export function usage(): string {
  return ['usage: vaultbook COMMAND ...', '', ...Object.values(COMMANDS).map((c) => `  vaultbook ${c.usage}`)].join('\n');
}

/**
 * Runs one command line; returns the exit code. Never throws for bad input.
 */
export async function main(argv: string[], out: (s: string) => void = (s) => process.stdout.write(s + '\n'), err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h') {
    out(usage());
    return name ? 0 : 2;
  }
  const command = COMMANDS[name];
  if (!command) {
    err(`vaultbook: unknown command "${name}"\n${usage()}`);
    return 2;
  }
  try {
    return await command.run(rest, out, err);
  } catch (e) {
    if (e instanceof UsageError) {
      err(`vaultbook ${name}: ${e.message}\n  vaultbook ${command.usage}`);
      return 2;
    }
    err(`vaultbook ${name}: internal error: ${(e as Error).stack ?? e}`);
    return 2;
  }
}

/**
 * `vaultbook new TEMPLATE FILE`: start a calc from one of the templates.
 * Without a TEMPLATE (or with an unknown one) it lists the templates and their
 * titles. It never overwrites: an existing FILE is refused (exit 2).
 */
import { readdir, writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { parseDocument } from 'yaml';
import { parse, UsageError } from '../args.js';
import { table } from '../table.js';
import { DocumentError, readDocument } from '../document.js';

export interface TemplateInfo {
  /** The name to type: the file name without `.md`. */
  name: string;
  path: string;
  title: string;
}

/** templates/ at the root of this repository. */
export const TEMPLATE_DIR = fileURLToPath(new URL('../../templates/', import.meta.url));

/** The title from a template's front matter, or its first heading, or ''. */
function titleOf(text: string): string {
  const fm = /^---[ \t]*\n([\s\S]*?)\n(?:---|\.\.\.)[ \t]*(?:\n|$)/.exec(text);
  if (fm) {
    const meta: unknown = parseDocument(fm[1]!).toJS();
    if (meta && typeof meta === 'object' && typeof (meta as { title?: unknown }).title === 'string') return (meta as { title: string }).title;
  }
  return /^#\s+(.+)$/m.exec(text)?.[1]?.trim() ?? '';
}

/** Every template in `dir`, sorted by name. */
export async function listTemplates(dir: string = TEMPLATE_DIR): Promise<TemplateInfo[]> {
  const names = (await readdir(dir).catch(() => [] as string[])).filter((n) => n.endsWith('.md')).sort();
  return Promise.all(names.map(async (n) => {
    const path = join(dir, n);
    // A template that cannot be read (a link to a pipe, not text, too large) lists with no title.
    const text = await readDocument(path).then((d) => d.text, () => '');
    return { name: n.slice(0, -3), path, title: titleOf(text) };
  }));
}

function listing(templates: TemplateInfo[]): string {
  if (templates.length === 0) return 'No templates are installed.';
  return `Templates (vaultbook new TEMPLATE FILE):\n\n${table(['template', 'title'], templates.map((t) => [t.name, t.title]))}`;
}

/**
 * Builds the command over a templates folder (tests pass their own).
 * @example await makeNewCommand('/tmp/templates')(['barrel-vault', 'hall.md'], console.log)
 */
export function makeNewCommand(dir: string) {
  return async (args: string[], out: (s: string) => void, err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> => {
    const { positionals } = parse(args, {});
    const templates = await listTemplates(dir);
    if (positionals.length === 0) {
      out(listing(templates));
      return 0;
    }
    const wanted = positionals[0]!.replace(/\.md$/, '');
    const template = templates.find((t) => t.name === wanted);
    if (!template) {
      err(`vaultbook new: no template "${positionals[0]}"`);
      out(listing(templates));
      return 2;
    }
    if (positionals.length !== 2) throw new UsageError('new takes a TEMPLATE and the FILE to create');
    const file = positionals[1]!;
    let text: string;
    try {
      ({ text } = await readDocument(template.path));
    } catch (e) {
      if (!(e instanceof DocumentError)) throw e;
      err(`vaultbook new: template ${template.name}: ${e.message}`);
      return 2;
    }
    try {
      // 'wx' fails if the file exists: an engineer's calc is never overwritten.
      await writeFile(file, text, { flag: 'wx' });
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      err(code === 'EEXIST'
        ? `vaultbook new: ${file} already exists; not overwritten. Choose another name or delete it first.`
        : `vaultbook new: cannot create ${file}: ${(e as Error).message}`);
      return 2;
    }
    out(`Created ${file} from template ${template.name}${template.title ? ` (${template.title})` : ''}.\nNext: edit its inputs, then run  vaultbook check ${file}`);
    return 0;
  };
}

export const newCommand = makeNewCommand(TEMPLATE_DIR);

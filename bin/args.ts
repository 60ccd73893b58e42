/**
 * Shared command-line parsing: `--set NAME=EXPR` (repeatable), `--json`, files.
 */
import { parseArgs, type ParseArgsConfig } from 'node:util';

export class UsageError extends Error {
  override name = 'UsageError';
}

/** Parses args, turning node's errors into usage messages. */
export function parse(args: string[], options: NonNullable<ParseArgsConfig['options']>) {
  try {
    return parseArgs({ args, options, allowPositionals: true, strict: true });
  } catch (e) {
    throw new UsageError((e as Error).message.replace(/^TypeError \[[A-Z_]+\]: /, ''));
  }
}

/** `--set L=7 m --set t=0.3 m` → {L: '7 m', t: '0.3 m'}. */
export function readOverrides(sets: string[] | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const s of sets ?? []) {
    const m = /^\s*([\p{L}_$][\p{L}\p{N}_$]*)\s*=(.*)$/su.exec(s);
    if (!m || m[2]!.trim() === '') throw new UsageError(`--set expects NAME=EXPR, e.g. --set "L=7.2 m"; got "${s}"`);
    out[m[1]!] = m[2]!.trim();
  }
  return out;
}

export const SET_OPTION = { set: { type: 'string', multiple: true, short: 's' } } as const;
export const JSON_OPTION = { json: { type: 'boolean' } } as const;
/** `--case NAME`: evaluate one case as if its inputs were written in the document. */
export const CASE_OPTION = { case: { type: 'string' } } as const;

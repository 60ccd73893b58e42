/**
 * A one-line progress bar for long archive checks, drawn on a terminal only:
 * logs and pipes get nothing, so captured output stays the final table.
 */

export interface ProgressStream {
  isTTY?: boolean;
  columns?: number;
  write(s: string): unknown;
}

export interface ProgressTally {
  fails: number;
  errors: number;
}

export interface Progress {
  update(done: number, total: number, tally: ProgressTally): void;
  /** Clears the bar so the table prints on a clean line. */
  finish(): void;
}

const QUIET: Progress = { update() {}, finish() {} };

/**
 * A progress bar on `stream` when it is a terminal, else one that does nothing.
 * @param stream usually process.stderr
 * @param now clock in ms (injectable for tests)
 * @example const bar = progressBar(process.stderr); bar.update(10, 100, {fails: 1, errors: 0}); bar.finish();
 */
export function progressBar(stream: ProgressStream, now: () => number = () => Date.now()): Progress {
  if (!stream.isTTY) return QUIET;
  const start = now();
  let last = -Infinity;
  let drawn = false;
  return {
    update(done, total, tally) {
      // Redraw at most ten times a second, and always for the last file.
      const t = now();
      if (t - last < 100 && done < total) return;
      last = t;
      const width = Math.max(10, Math.min(40, (stream.columns ?? 80) - 60));
      const filled = total === 0 ? width : Math.round((width * done) / total);
      const bar = '█'.repeat(filled) + '░'.repeat(width - filled);
      const secs = ((t - start) / 1000).toFixed(1);
      const fails = tally.fails === 0 ? '' : `  ${tally.fails} failing`;
      const errors = tally.errors === 0 ? '' : `  ${tally.errors} with errors`;
      stream.write(`\r\x1b[2K${bar} ${done}/${total} files${fails}${errors}  ${secs} s`);
      drawn = true;
    },
    finish() {
      if (drawn) stream.write('\r\x1b[2K');
    },
  };
}

/**
 * Bench: 10,000 mutated documents (test/helpers/mutate.ts), evaluated in a child process
 * watched from here. A document that throws out of evaluateDocument is a crash; a child
 * that dies is an abort; one that prints nothing for 5 s is a hang (it is killed and the
 * run goes on after that document); a diagnostic outside the document is unlocated.
 * Target: all four zero. `FUZZ_DOCS=n` changes the count.
 */
import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';

const WORKER = fileURLToPath(new URL('./fuzz-worker.ts', import.meta.url));
const HANG_MS = 5_000;
/** Loading the engine through tsx in a fresh process, on a busy machine. */
const STARTUP_MS = 120_000;

interface Tally { crashes: string[]; aborts: number[]; hangs: number[]; unlocated: string[]; slowest: [number, number]; done: number }

/** Runs documents from..to in one child; resolves with the next document to start from (to when finished). */
function runChild(from: number, to: number, tally: Tally): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', WORKER, String(from), String(to)], { stdio: ['ignore', 'pipe', 'pipe'] });
    let next = from;
    let finished = false;
    let timer: NodeJS.Timeout;
    const watch = (ms = HANG_MS) => {
      clearTimeout(timer);
      timer = setTimeout(() => { tally.hangs.push(next); child.kill('SIGKILL'); }, ms);
    };
    watch(STARTUP_MS);
    child.stderr.resume();
    createInterface({ input: child.stdout }).on('line', (line) => {
      if (line === 'done') { finished = true; return; }
      if (line === 'ready') { watch(); return; }
      watch();
      const [n, kind, ms, ...rest] = line.split(' ');
      next = Number(n) + 1;
      tally.done++;
      if (Number(ms) > tally.slowest[1]) tally.slowest = [Number(n), Number(ms)];
      if (kind === 'crash') tally.crashes.push(`${n}: ${rest.join(' ')}`);
      if (kind === 'unlocated') tally.unlocated.push(`${n}: ${rest.join(' ')}`);
    });
    child.on('exit', (code, signal) => {
      clearTimeout(timer);
      if (!finished && !tally.hangs.includes(next)) tally.aborts.push(next);
      if (!finished) { tally.done++; next++; } // the document that hung or aborted counts, and is skipped
      resolve(finished ? to : next);
      void code; void signal;
    });
  });
}

export async function run(): Promise<string[]> {
  const total = Number(process.env.FUZZ_DOCS ?? 10_000);
  const tally: Tally = { crashes: [], aborts: [], hangs: [], unlocated: [], slowest: [0, 0], done: 0 };
  const t0 = performance.now();
  let next = 0;
  while (next < total) next = await runChild(next, total, tally);
  const s = ((performance.now() - t0) / 1000).toFixed(0);
  const lines = [
    `fuzz: ${tally.done.toLocaleString('en-US')} mutated documents in ${s} s: ${tally.crashes.length} crashes, ${tally.aborts.length} aborts, `
      + `${tally.hangs.length} hangs over ${HANG_MS / 1000} s, ${tally.unlocated.length} with an unlocated diagnostic; `
      + `slowest document #${tally.slowest[0]} ${tally.slowest[1]} ms (target: 0, 0, 0, 0)`,
  ];
  for (const c of tally.crashes.slice(0, 5)) lines.push(`  crash ${c}`);
  for (const a of tally.aborts.slice(0, 5)) lines.push(`  abort at document ${a}`);
  for (const h of tally.hangs.slice(0, 5)) lines.push(`  hang at document ${h}`);
  for (const u of tally.unlocated.slice(0, 5)) lines.push(`  unlocated ${u}`);
  return lines;
}

// Run on its own: `npx tsx test/bench/fuzz.bench.ts`.
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  for (const line of await run()) console.log(line);
}

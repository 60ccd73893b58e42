/**
 * A generated archive of small calcs for the archive-check test and bench.
 *
 * Fictional: "Pier bearing checks for the Larkhollow estate" does not exist. Each
 * document checks one masonry pier in axial compression with a made-up reduction
 * table read with interp(); it uses only the engine and the table helpers, so it
 * runs before any vault kernel lands. The expected verdicts are computed here in
 * plain arithmetic, independently of the engine.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';

/** Slenderness ratios and reduction factors of the invented table (shape like a capacity-reduction curve; not from a code). */
const TABLE_X = [0, 6, 12, 18, 27];
const TABLE_Y = [1, 0.9, 0.75, 0.55, 0.3];
/** Design compressive strength used by every pier, MPa (invented). */
const F_D = 2.5;

export interface PlantedFile {
  path: string;
  checks: number;
  fails: number;
  errors: number;
  /** Highest utilization among judged checks (hand calc), null when none. */
  worst: number | null;
}

function interp(x: number): number {
  let i = 1;
  while (x > TABLE_X[i]!) i++;
  const f = (x - TABLE_X[i - 1]!) / (TABLE_X[i]! - TABLE_X[i - 1]!);
  return TABLE_Y[i - 1]! + f * (TABLE_Y[i]! - TABLE_Y[i - 1]!);
}

/**
 * The document for pier i and what checking it must report.
 * Every 10th pier (i % 10 == 3) is overloaded; every 97th (i % 97 == 5) is so
 * slender that the table refuses it (an error in Phi, and the slenderness check fails).
 */
export function pierCalc(i: number): { text: string; expected: Omit<PlantedFile, 'path'> } {
  const b = 0.35 + (i % 7) * 0.05; // m
  const d = 0.45 + (i % 5) * 0.05; // m
  const tooSlender = i % 97 === 5;
  const hEf = tooSlender ? 30 * b : 2.4 + (i % 4) * 0.3; // m
  const slender = hEf / Math.min(b, d);
  const overloaded = i % 10 === 3 && !tooSlender;
  const area = b * d;
  const nRdHand = tooSlender ? NaN : interp(slender) * area * F_D * 1000; // kN
  const nEd = Math.round(overloaded ? nRdHand * 1.25 : 0.3 * area * F_D * 1000 * (0.4 + (i % 3) * 0.1)); // kN
  const text = `---
title: Pier P${i} bearing check
project: Larkhollow estate (fictional, generated for tests)
job: LH-${String(i).padStart(4, '0')}
calc_ref: LH/P${i}
revision: A
---
# Pier P${i}

Fictional generated calc. Pier P${i} carries a floor beam; it is checked in
axial compression with an invented slenderness reduction table.

\`\`\`given
b = ${b.toFixed(2)} m     # pier width [0.2 m, 2 m]
d = ${d.toFixed(2)} m     # pier depth [0.2 m, 2 m]
h_ef = ${hEf.toFixed(3)} m  # effective height
N_Ed = ${nEd} kN      # design axial load
f_d = ${F_D} MPa      # design compressive strength (invented)
\`\`\`

\`\`\`calc
A = b * d to m^2                   # bearing area
lambda = h_ef / min(b, d)          # slenderness ratio
Phi = interp(lambda, [${TABLE_X.join(', ')}], [${TABLE_Y.join(', ')}])  # reduction factor (invented table)
N_Rd = Phi * A * f_d to kN         # resistance
\`\`\`

\`\`\`check
bearing = N_Ed <= N_Rd    # axial load within resistance
slender = lambda <= 27    # slenderness limit
\`\`\`
`;
  const uSlender = slender / 27;
  const expected = tooSlender
    ? { checks: 2, fails: 1, errors: 1, worst: uSlender }
    : { checks: 2, fails: overloaded ? 1 : 0, errors: 0, worst: Math.max(nEd / nRdHand, uSlender) };
  return { text, expected };
}

/**
 * Writes `count` pier calcs into `dir` (in subfolders of 100, as an archive would be).
 * @returns the planted files with their expected verdicts
 */
export async function writeArchive(dir: string, count: number): Promise<PlantedFile[]> {
  const planted: PlantedFile[] = [];
  for (let i = 0; i < count; i++) {
    const folder = join(dir, `block-${String(Math.floor(i / 100)).padStart(2, '0')}`);
    if (i % 100 === 0) await mkdir(folder, { recursive: true });
    const path = join(folder, `pier-${String(i).padStart(4, '0')}.md`);
    const { text, expected } = pierCalc(i);
    await writeFile(path, text);
    planted.push({ path, ...expected });
  }
  return planted;
}

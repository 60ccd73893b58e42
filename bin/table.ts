/** A terminal line's width: the rule under the last column stops there, however long a value (a kernel record in eval). */
const RULE_WIDTH = 80;

/** A plain text table with padded columns, for terminals and logs. */
export function table(head: string[], rows: string[][]): string {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === cells.length - 1 ? c : c.padEnd(widths[i]!))).join('  ').trimEnd();
  const before = widths.slice(0, -1).reduce((sum, w) => sum + w + 2, 0);
  const last = widths.length - 1;
  const rule = widths.map((w, i) => '─'.repeat(i === last ? Math.max(head[i]!.length, Math.min(w, RULE_WIDTH - before)) : w));
  return [line(head), line(rule), ...rows.map(line)].join('\n');
}

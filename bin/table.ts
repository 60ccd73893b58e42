/** A plain text table with padded columns, for terminals and logs. */
export function table(head: string[], rows: string[][]): string {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === cells.length - 1 ? c : c.padEnd(widths[i]!))).join('  ').trimEnd();
  return [line(head), line(widths.map((w) => '─'.repeat(w))), ...rows.map(line)].join('\n');
}

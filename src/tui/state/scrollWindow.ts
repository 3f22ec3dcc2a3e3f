/** The first row to show so that `cursor` stays visible in a list of `total` rows, `rows` at a time. */
export function scrollStart(cursor: number, total: number, rows: number): number {
  if (total <= rows) return 0;
  return Math.max(0, Math.min(total - rows, cursor - Math.floor(rows / 2)));
}

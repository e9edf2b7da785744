/** A horizontal extent on screen, px (start ≤ end). */
export interface Extent {
  start: number;
  end: number;
}

/**
 * Rows for extents so that no two in a row overlap or come closer than `gap` px: each extent, taken
 * by its start, goes into the first row that is free by then. Taken in start order this greedy uses
 * as few rows as the most extents overlapping at one point (interval partitioning), so overlapping
 * flags stack only as deep as they must.
 * Returns the row (0 = top) of each extent, in the order given, and the number of rows.
 */
export function stackRows(extents: readonly Extent[], gap = 0): { rows: number[]; rowCount: number } {
  const order = extents.map((_, index) => index).sort((a, b) => extents[a].start - extents[b].start);
  /** The end of the last extent placed in each row. */
  const rowEnds: number[] = [];
  const rows = new Array<number>(extents.length);
  for (const index of order) {
    const { start, end } = extents[index];
    let row = rowEnds.findIndex((rowEnd) => rowEnd + gap <= start);
    if (row === -1) {
      row = rowEnds.length;
      rowEnds.push(end);
    } else rowEnds[row] = end;
    rows[index] = row;
  }
  return { rows, rowCount: rowEnds.length };
}

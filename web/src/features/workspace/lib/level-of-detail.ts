/** One pixel column of a reduced series: the extremes of every sample that falls into it. */
export interface MinMaxColumn {
  /** Index of the first step in the column. */
  index: number;
  min: number;
  max: number;
}

/**
 * Min/max decimation for drawing a long series on `columns` pixel columns: each column keeps the
 * smallest and largest finite value of the steps it covers, so spikes and dips survive the
 * reduction (a plain every-n-th sample would drop them). Steps `[from, to)`; null/NaN are skipped;
 * a column with no finite value is left out, so gaps stay gaps.
 */
export function reduceMinMax(
  values: ArrayLike<number | null>,
  from: number,
  to: number,
  columns: number,
): MinMaxColumn[] {
  const count = Math.max(0, to - from);
  const out: MinMaxColumn[] = [];
  if (count === 0 || columns <= 0) return out;
  const perColumn = Math.max(1, count / Math.floor(columns));
  let columnStart = from;
  for (let c = 0; columnStart < to; c++) {
    const columnEnd = Math.min(to, Math.max(columnStart + 1, Math.round(from + (c + 1) * perColumn)));
    let min = Number.POSITIVE_INFINITY;
    let max = Number.NEGATIVE_INFINITY;
    for (let k = columnStart; k < columnEnd; k++) {
      const value = values[k];
      if (value === null || !Number.isFinite(value)) continue;
      if (value < min) min = value;
      if (value > max) max = value;
    }
    if (min <= max) out.push({ index: columnStart, min, max });
    columnStart = columnEnd;
  }
  return out;
}

/** Whether the steps in view are dense enough (more than one per pixel) to need the reduction. */
export function needsReduction(stepsInView: number, widthPx: number): boolean {
  return stepsInView > widthPx;
}

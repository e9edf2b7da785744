import { type Extent, stackRows } from './stack-rows';

/** A flag's bar on screen, px, and the width its label needs. */
export interface FlagBar {
  x0: number;
  x1: number;
  labelWidth: number;
}

/** Where a flag's bar and label go: its row and the label's left edge, px. */
export interface PlacedFlag {
  row: number;
  labelX: number;
}

/** Space between a bar's edge and its label, and between neighbours in a row, px. */
const LABEL_PAD = 4;

/**
 * Rows for the flag band: each flag takes its bar plus its whole label (the label starts inside
 * the bar and runs past a short one), shifted left where it would run past `right`, so no label is
 * cut off and no two flags in a row touch.
 */
export function layoutFlagBand(
  bars: readonly FlagBar[],
  left: number,
  right: number,
): { placed: PlacedFlag[]; rowCount: number } {
  const labelXs = bars.map((bar) =>
    Math.max(left, Math.min(bar.x0 + LABEL_PAD, right - LABEL_PAD - bar.labelWidth)),
  );
  const extents: Extent[] = bars.map((bar, i) => ({
    start: Math.min(bar.x0, labelXs[i] - LABEL_PAD),
    end: Math.max(bar.x1, labelXs[i] + bar.labelWidth + LABEL_PAD),
  }));
  const { rows, rowCount } = stackRows(extents, LABEL_PAD);
  return { placed: rows.map((row, i) => ({ row, labelX: labelXs[i] })), rowCount };
}

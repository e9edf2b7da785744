/**
 * Writes replay series columns (one array per diagnostic, index = step, null for undefined) as
 * CSV with one row per step: `step,<column>,...`. Numbers keep JavaScript's shortest round-trip
 * form, so parsing the CSV gives back the exact float64 values.
 */
export function seriesColumnsToCsv(columns: Record<string, readonly (number | null)[]>): string {
  const names = Object.keys(columns);
  const steps = names.reduce((most, name) => Math.max(most, columns[name].length), 0);
  const lines = [['step', ...names].join(',')];
  for (let step = 0; step < steps; step++) {
    const cells = [String(step)];
    for (const name of names) {
      const value = columns[name][step];
      cells.push(value === null || value === undefined ? '' : String(value));
    }
    lines.push(cells.join(','));
  }
  return `${lines.join('\n')}\n`;
}

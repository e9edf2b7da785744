import { describe, expect, it } from 'vitest';
import { CELL_FREE, CELL_OCCUPIED, CELL_UNKNOWN } from '../../../shared/bundle/types';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import {
  expectIssue,
  fixtureMap,
  issuesWithFile,
  makeBundleFiles,
  withFile,
} from '../../support/bundle-fixtures';

const mapWith = (change: Record<string, unknown>) => JSON.stringify({ ...fixtureMap(), ...change });

describe('map.json', () => {
  it('packs rows with row 0 northmost, as the format defines cell centres', () => {
    const result = validateBundleFiles(makeBundleFiles());
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const grid = result.bundle.map.grid!;
    // Format rule: cell (i, j) centre y = origin_y + (height - i - 0.5) * resolution, so row 0 is at the top.
    const cellAt = (i: number, j: number) => grid.cells[i * grid.width + j];
    expect(cellAt(0, 0)).toBe(CELL_OCCUPIED);
    expect(cellAt(1, 1)).toBe(CELL_FREE);
    expect(cellAt(2, 3)).toBe(CELL_UNKNOWN);
    expect(grid.cells.length).toBe(8 * 4);
  });

  it('names the row whose length differs from width', () => {
    const issues = issuesWithFile(
      'map.json',
      mapWith({ rows: ['########', '#.....#', '#..?...#', '########'] }),
    );
    expectIssue(
      issues,
      { file: 'map.json', field: 'rows[1]', expected: '8 characters', found: '7 characters' },
      /width/,
    );
  });

  it('requires height rows', () => {
    const issues = issuesWithFile('map.json', mapWith({ rows: ['########', '#......#', '########'] }));
    expectIssue(issues, { file: 'map.json', field: 'rows', expected: '4', found: '3' }, /height/);
  });

  it('rejects characters other than . # ?', () => {
    const issues = issuesWithFile(
      'map.json',
      mapWith({ rows: ['########', '#..x...#', '#..?...#', '########'] }),
    );
    expectIssue(issues, { file: 'map.json', field: 'rows[1]' }, /only "\." \(free\)/);
  });

  it('rejects a landmark class the detector does not know', () => {
    const landmarks = [{ id: 'P-1', class: 'pallet', x: 1, y: 1 }];
    const issues = issuesWithFile('map.json', mapWith({ landmarks }));
    expectIssue(
      issues,
      { file: 'map.json', field: 'landmarks[0].class', found: '"pallet"' },
      /not one of the detector classes/,
    );
  });

  it('accepts a grid-only map with no landmarks', () => {
    const manifestFree = withFile(makeBundleFiles(), 'map.json', mapWith({ landmarks: [] }));
    expect(validateBundleFiles(manifestFree).issues).toEqual([]);
  });

  it('rejects duplicate landmark ids', () => {
    const landmarks = [
      { id: 'R-1', class: 'reflector', x: 1, y: 1 },
      { id: 'R-1', class: 'dock', x: 2, y: 1 },
    ];
    expectIssue(
      issuesWithFile('map.json', mapWith({ landmarks })),
      { field: 'landmarks[1].id' },
      /duplicate/,
    );
  });
});

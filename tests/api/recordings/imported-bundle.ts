import { expect } from 'vitest';
import { inspectBundle } from '../../../api/src/bundles/inspect-bundle';

/** The bundle an import wrote, read back by the bundle reader, which must find no error in it. */
export async function importedBundle(source: { kind: 'zip' | 'folder'; path: string }) {
  const inspection = await inspectBundle(source);
  expect(inspection.issues.filter((issue) => issue.severity !== 'warning')).toEqual([]);
  if (!inspection.bundle) throw new Error('no bundle');
  return inspection.bundle;
}

import path from 'node:path';
import type { BundleIssue } from '../../../../shared/bundle/types';
import { inspectBundle } from '../../bundles/inspect-bundle';
import { writeArrowTables } from '../../bundles/write-arrow-tables';

/** The bundle reader; a parameter so tests can make validation fail at will. */
export type InspectBundle = typeof inspectBundle;

export interface StoredBundleValidation {
  inspection: Awaited<ReturnType<InspectBundle>>;
  issues: BundleIssue[];
  tables: { name: string; rows: number }[];
}

/**
 * Validates a stored original and writes its derived tables. Never throws for what is in the
 * file: a reader failure becomes an issue, so the original's row always gets a final status.
 */
export async function validateStoredBundle(options: {
  storedPath: string;
  originalName: string;
  tablesDir: string;
  maxUnpackedBytes: number;
  inspect?: InspectBundle;
}): Promise<StoredBundleValidation> {
  const { storedPath, originalName, tablesDir, maxUnpackedBytes, inspect = inspectBundle } = options;
  let inspection: Awaited<ReturnType<InspectBundle>>;
  try {
    inspection = await inspect({ kind: 'zip', path: storedPath }, { maxTotalBytes: maxUnpackedBytes });
  } catch (error) {
    inspection = {
      ok: false,
      files: [],
      issues: [
        {
          file: originalName,
          message: `The archive could not be read: ${String(error)}`,
          severity: 'error',
        },
      ],
    };
  }
  // Issues about the archive itself name the stored copy; show the name the investigator knows.
  const storedName = path.basename(storedPath);
  let issues: BundleIssue[] = inspection.issues.map((issue) =>
    issue.file === storedName ? { ...issue, file: originalName } : issue,
  );
  let tables: { name: string; rows: number }[] = [];
  if (inspection.ok && inspection.bundle) {
    try {
      const written = await writeArrowTables(inspection.bundle, tablesDir);
      tables = written.map(({ name, rows }) => ({ name, rows }));
    } catch (error) {
      // Derived data only: the bundle stays valid evidence even if the copy fails.
      issues = [
        ...issues,
        {
          file: '(derived tables)',
          message: `Could not write Arrow tables: ${String(error)}`,
          severity: 'warning',
        },
      ];
    }
  }
  return { inspection, issues, tables };
}

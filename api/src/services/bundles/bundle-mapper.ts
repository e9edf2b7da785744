import type { TBundleRecord } from '../../../../shared/contracts/bundles';
import type { BundleRow } from '../../db/schema';

export type { TBundleRecord };

export function toBundleRecord(row: BundleRow, uploaderName: string): TBundleRecord {
  return {
    id: row.id,
    caseId: row.caseId,
    sha256: row.sha256,
    sizeBytes: row.sizeBytes,
    originalName: row.originalName,
    uploadedBy: { id: row.uploadedBy, name: uploaderName },
    uploadedAt: row.uploadedAt.toISOString(),
    status: row.status,
    issues: row.issues as TBundleRecord['issues'],
    files: row.files as TBundleRecord['files'],
    summary: row.summary as TBundleRecord['summary'],
    tables: row.tables as TBundleRecord['tables'],
  };
}

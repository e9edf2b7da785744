import type { TCase, TCasePath } from '../../../../shared/contracts/cases';
import type { CaseRow } from '../../db/schema';

export function toCase(row: CaseRow, createdBy: { id: string; name: string }, path: TCasePath): TCase {
  return {
    id: row.id,
    reference: row.reference,
    title: row.title,
    site: row.site,
    robotId: row.robotId,
    incidentTime: row.incidentTime.toISOString(),
    severity: row.severity,
    status: row.status,
    summary: row.summary,
    createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    path,
  };
}

import { eq } from 'drizzle-orm';
import type { TCaseStatus } from '../../../../shared/contracts/cases';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { cases } from '../../db/schema';

/** The case's status and creator, or a 404 naming the id. */
export async function loadCaseState(
  db: Database,
  caseId: string,
): Promise<{ id: string; status: TCaseStatus; createdBy: string; reference: string; title: string }> {
  const [row] = await db
    .select({
      id: cases.id,
      status: cases.status,
      createdBy: cases.createdBy,
      reference: cases.reference,
      title: cases.title,
    })
    .from(cases)
    .where(eq(cases.id, caseId));
  if (!row) throw new AppError('not_found', `No case with id ${caseId}.`);
  return row;
}

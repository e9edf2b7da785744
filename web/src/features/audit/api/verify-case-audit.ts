import { type TAuditVerifyResponse, ZAuditVerifyResponse } from '@shared/contracts/audit';
import { useMutation } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** Recomputes the case's hash chain on the server; a read, but run on demand like an action. */
export function verifyCaseAudit(caseId: string): Promise<TAuditVerifyResponse> {
  return apiRequest(apiPaths.caseAuditVerify(caseId), { schema: ZAuditVerifyResponse });
}

export function useVerifyCaseAudit(caseId: string) {
  return useMutation({ mutationFn: () => verifyCaseAudit(caseId) });
}

import { createHash } from 'node:crypto';
import { canonicalJson } from '../../../../shared/canonical-json';
import type { TFindingsContent } from '../../../../shared/contracts/findings';
import type { Person } from './people';

/**
 * The frozen findings version: what is hashed, signed and archived. Its RFC 8785 text is the
 * JWS payload, so anyone with the public key can check it without Driftcase.
 */
export interface FindingsDocument {
  schema: 'driftcase.findings/1';
  caseId: string;
  caseReference: string;
  version: number;
  author: Person;
  /** RFC 3339. */
  submittedAt: string;
  content: TFindingsContent;
}

export function freezeFindings(document: FindingsDocument): { canonical: string; sha256: string } {
  const canonical = canonicalJson(document);
  return { canonical, sha256: createHash('sha256').update(canonical, 'utf8').digest('hex') };
}

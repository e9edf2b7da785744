import type { Role } from '../../../shared/roles';

/**
 * Who performs a write, as services check it and record it in the audit trail. A session user
 * (`req.user`) is one; the audit trail keeps only id, e-mail and role.
 */
export interface Actor {
  id: string;
  email: string;
  role: Role;
}

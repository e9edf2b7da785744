import type { Role } from '../../../../shared/roles';

/** The signed-in person as the request handlers see them. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  sessionId: string;
  /** How the request proved itself: cookie requests need the CSRF header on writes. */
  via: 'cookie' | 'bearer';
}

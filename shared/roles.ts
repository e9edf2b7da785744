/** The five roles of Driftcase. Every API route names the roles that may call it. */
export const ROLES = ['investigator', 'reviewer', 'legal', 'engineer', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  investigator: 'Investigator',
  reviewer: 'Safety reviewer',
  legal: 'Legal',
  engineer: 'Engineer',
  admin: 'Administrator',
};

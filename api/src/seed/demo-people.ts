import type { Role } from '../../../shared/roles';

/** Password of every demo account. For local use only; stated in the README. */
export const DEMO_PASSWORD = 'driftcase-demo';

/** One invented person per role at the invented Harbourline site. */
export const DEMO_PEOPLE: { email: string; name: string; role: Role }[] = [
  { email: 'investigator@driftcase.example', name: 'Ines Okafor', role: 'investigator' },
  { email: 'reviewer@driftcase.example', name: 'Ruben Valdivia', role: 'reviewer' },
  { email: 'legal@driftcase.example', name: 'Leah Marchetti', role: 'legal' },
  { email: 'engineer@driftcase.example', name: 'Emeka Lindqvist', role: 'engineer' },
  { email: 'admin@driftcase.example', name: 'Ada Brennan', role: 'admin' },
];

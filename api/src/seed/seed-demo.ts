import { count } from 'drizzle-orm';
import type { TCreateCaseRequest } from '../../../shared/contracts/cases';
import type { Database } from '../db/client';
import { users } from '../db/schema';
import { createCasesService } from '../services/cases/cases-service';
import { createUsersService } from '../services/users/users-service';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';

const DEMO_CASES: TCreateCaseRequest[] = [
  {
    title: 'Tugger brushed a picker at rack row C after a wet-floor slip',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-07',
    incidentTime: '2026-11-14T09:13:05Z',
    severity: 'high',
    summary:
      'Bumper contact at low speed near rack row C; the picker was unhurt. Floor had been mopped minutes before.',
  },
  {
    title: 'Protective stop beside the relocated pallet rack',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-11',
    incidentTime: '2026-11-18T14:40:30Z',
    severity: 'medium',
    summary: 'Robot stopped 0.4 m from a rack that was moved during the weekend re-layout.',
  },
  {
    title: 'Robot displaced by a forklift at dock door 3',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-07',
    incidentTime: '2026-11-21T06:05:12Z',
    severity: 'critical',
    summary: 'A reversing forklift nudged the robot sideways; it drove on with a wrong position estimate.',
  },
  {
    title: 'Near miss in the chiller aisle with a fogged laser window',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-03',
    incidentTime: '2026-11-25T22:51:47Z',
    severity: 'low',
    summary: 'Warning field triggered twice while the scanner window was fogged after a door cycle.',
  },
];

/**
 * Seeds one account per role and a few cases, only into an empty database: a database that
 * already has users is never touched.
 */
export async function seedDemoData(db: Database): Promise<boolean> {
  const [{ existing }] = await db.select({ existing: count() }).from(users);
  if (existing > 0) return false;
  const usersService = createUsersService({ db });
  const people = [];
  for (const person of DEMO_PEOPLE) {
    people.push(await usersService.createUser({ ...person, password: DEMO_PASSWORD }));
  }
  const investigator = people.find((p) => p.role === 'investigator')!;
  const casesService = createCasesService({ db });
  for (const demoCase of DEMO_CASES) await casesService.createCase(demoCase, investigator.id);
  return true;
}

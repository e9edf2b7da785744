import type { TCreateCaseRequest } from '../../../shared/contracts/cases';

/** Invented incidents at the invented Harbourline site, each with the sample bundle that records it. */
export const DEMO_CASES: (TCreateCaseRequest & { sampleFolder: string })[] = [
  {
    title: 'Tugger brushed a picker by the leaking defrost drain in aisle 2',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-11',
    incidentTime: '2026-11-16T13:47:52Z',
    severity: 'high',
    summary:
      'Protective stop at low speed after the left wheel spun on a wet patch; the picker stepped back in time. Floor had been mopped minutes before.',
    sampleFolder: 'wheel-slip',
  },
  {
    title: 'Contact with rack row B after the overnight re-layout',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-03',
    incidentTime: '2026-11-18T05:31:42Z',
    severity: 'medium',
    summary:
      'Rack row B east block was moved 1.2 m west overnight; the robot still used the old map at the cross aisle.',
    sampleFolder: 'moved-rack',
  },
  {
    title: 'Robot nudged sideways by a reversing reach truck in aisle 3',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-09',
    incidentTime: '2026-11-19T22:16:07Z',
    severity: 'critical',
    summary:
      'A reach truck pushed the robot about 0.7 m sideways; it drove on with a wrong position estimate.',
    sampleFolder: 'pushed-aside',
  },
  {
    title: 'Near miss leaving the freezer chamber with a fogged scanner window',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-05',
    incidentTime: '2026-11-21T10:04:40Z',
    severity: 'low',
    summary:
      'Warning field triggered twice while the scanner window was fogged after the freezer door cycle.',
    sampleFolder: 'degraded-sensor',
  },
  {
    title: 'Baseline: morning picking loop on a dry floor',
    site: 'Harbourline Cold Store, Dock Hall B',
    robotId: 'AMR-07',
    incidentTime: '2026-11-14T06:02:41Z',
    severity: 'low',
    summary: 'No incident: a healthy shift kept for comparison replays.',
    sampleFolder: 'healthy-shift',
  },
];

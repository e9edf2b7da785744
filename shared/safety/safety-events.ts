/**
 * For each safety event of the bundle (contact, protective and emergency stops, warning field):
 * the numbers at the event, the moment the stopping margin went negative before it, how much of
 * the belief gap was localization error, the ISO/TS 15066 separation, and a suggested class.
 */
import type { Bundle } from '../bundle/types';
import type { ProtectiveSeparationAtEvent, SafetyEvent, SuggestedClass } from './safety-report';
import { SAFETY_EVENT_KINDS } from './safety-report';
import type { SafetySettings } from './safety-settings';
import { ISO_TS_15066_EDITION, protectiveSeparationDistance } from './separation-formulas';

/** The per-step columns events are judged on (NaN where unknown). */
export interface EventColumns {
  t: Float64Array;
  had: Float64Array;
  /** `had` through a median of three steps, so one noisy reading does not decide a class. */
  hadSteady: Float64Array;
  believed: Float64Array;
  speed: Float64Array;
  stoppingDistance: Float64Array;
  stoppingTime: Float64Array;
  /** Clearance at the "had" pose against the map alone. */
  mapHad: Float64Array;
  margin: Float64Array;
  positionUncertainty95: Float64Array;
}

/** Longest stop (s) an event's window reaches forward. */
const MAX_STOP_WINDOW = 5;
const PEOPLE_RELATED = new Set(['warning_field', 'protective_stop', 'emergency_stop']);

const value = (v: number) => (Number.isFinite(v) ? v : null);
const metres = (v: number | null) => (v === null ? 'unknown' : `${v.toFixed(2)} m`);

function stepAt(t: Float64Array, time: number): number {
  let s = 0;
  while (s + 1 < t.length && t[s + 1] <= time) s++;
  return s;
}

/** Start step of the negative-margin run at or last before `s`, within `lookback` s; -1 if none. */
function negativeRunStart(columns: EventColumns, s: number, lookback: number): number {
  let k = s;
  const earliest = columns.t[s] - lookback;
  while (k >= 0 && columns.t[k] >= earliest && !(columns.margin[k] < 0)) k--;
  if (k < 0 || columns.t[k] < earliest) return -1;
  while (k > 0 && columns.margin[k - 1] < 0) k--;
  return k;
}

function suggest(
  kind: string,
  contactAt: number | undefined,
  nearby: number | null,
  hadNegativeMargin: boolean,
  settings: SafetySettings,
): { suggested: SuggestedClass; reason: string } {
  if (kind === 'contact')
    return { suggested: 'contact', reason: 'the bundle records a contact (bumper or collision)' };
  if (contactAt !== undefined)
    return {
      suggested: 'contact',
      reason: `a contact is recorded at ${contactAt.toFixed(2)} s, before the robot could have stopped`,
    };
  if (nearby !== null && nearby <= settings.contact_clearance)
    return {
      suggested: 'contact',
      reason: `the clearance fell to ${metres(nearby)} (at or below ${metres(settings.contact_clearance)}) around the event`,
    };
  if (nearby !== null && nearby < settings.near_miss_clearance)
    return {
      suggested: 'near_miss',
      reason: `it stopped short of contact with ${metres(nearby)} to spare, less than ${metres(settings.near_miss_clearance)}`,
    };
  if (hadNegativeMargin)
    return { suggested: 'near_miss', reason: 'the stopping margin was negative before the event' };
  return {
    suggested: 'no_hazard',
    reason: `the clearance stayed at ${metres(nearby)} or more and the stopping margin stayed positive`,
  };
}

export function analyseSafetyEvents(
  bundle: Bundle,
  columns: EventColumns,
  settings: SafetySettings,
): SafetyEvent[] {
  const events = bundle.events;
  if (!events || columns.t.length === 0) return [];
  const { reaction_time, max_decel } = bundle.manifest.robot;
  const out: SafetyEvent[] = [];
  for (let e = 0; e < events.t.length; e++) {
    const kind = events.kind[e];
    if (!(SAFETY_EVENT_KINDS as readonly string[]).includes(kind)) continue;
    const time = events.t[e];
    const s = stepAt(columns.t, time);
    const windowEnd =
      time +
      Math.min(MAX_STOP_WINDOW, Number.isFinite(columns.stoppingTime[s]) ? columns.stoppingTime[s] : 0) +
      1;
    let nearby = Number.POSITIVE_INFINITY;
    for (let k = 0; k < columns.t.length && columns.t[k] <= windowEnd; k++) {
      if (columns.t[k] >= time - 1 && columns.hadSteady[k] < nearby) nearby = columns.hadSteady[k];
    }
    const runStart = negativeRunStart(columns, s, settings.lookback);
    const g = runStart >= 0 ? runStart : s;
    const speed = value(Math.abs(columns.speed[s]));
    const had = value(columns.had[s]);
    let separation: ProtectiveSeparationAtEvent | null = null;
    if (PEOPLE_RELATED.has(kind) && speed !== null) {
      const terms = {
        humanSpeed: settings.human_speed,
        robotSpeed: speed,
        reactionTime: reaction_time,
        stoppingTime: speed / max_decel,
        stoppingDistance: (speed * speed) / (2 * max_decel),
        intrusion: settings.intrusion,
        sensorUncertainty: settings.sensor_uncertainty,
        robotUncertainty: Number.isFinite(columns.positionUncertainty95[s])
          ? columns.positionUncertainty95[s]
          : 0,
      };
      const result = protectiveSeparationDistance(terms);
      separation = {
        edition: ISO_TS_15066_EDITION,
        human_speed: terms.humanSpeed,
        robot_speed: terms.robotSpeed,
        reaction_time: terms.reactionTime,
        stopping_time: terms.stoppingTime,
        stopping_distance: terms.stoppingDistance,
        intrusion: terms.intrusion,
        sensor_uncertainty: terms.sensorUncertainty,
        robot_uncertainty: terms.robotUncertainty,
        total: result.total,
        shortfall: had === null ? null : result.total - had,
      };
    }
    const nearbyValue = Number.isFinite(nearby) ? nearby : null;
    let contactAt: number | undefined;
    for (let c = 0; c < events.t.length && contactAt === undefined; c++) {
      if (events.kind[c] === 'contact' && events.t[c] >= time && events.t[c] <= windowEnd)
        contactAt = events.t[c];
    }
    const { suggested, reason } = suggest(kind, contactAt, nearbyValue, runStart >= 0, settings);
    out.push({
      t: time,
      kind,
      detail: events.detail[e],
      suggested_class: suggested,
      reason: `Suggestion: ${reason}.`,
      speed,
      clearance: had,
      clearance_believed: value(columns.believed[s]),
      min_clearance_nearby: nearbyValue,
      stopping_distance: value(columns.stoppingDistance[s]),
      margin: value(columns.margin[s]),
      margin_negative_since: runStart >= 0 ? columns.t[runStart] : null,
      gap_at: columns.t[g],
      localization_gap: value(columns.believed[g] - columns.mapHad[g]),
      map_gap: value(columns.mapHad[g] - columns.had[g]),
      separation,
    });
  }
  return out;
}

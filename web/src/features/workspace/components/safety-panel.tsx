import type { SafetyEvent, SafetyReport } from '@shared/safety/safety-report';
import { SafetyCautionNote } from '@web/components/safety-caution-note';
import { useMemo } from 'react';
import { SeparationFormulasCard } from './separation-formulas-card';

const CLASS_WORDS: Record<string, string> = {
  contact: 'Contact',
  near_miss: 'Near miss',
  no_hazard: 'No hazard',
};
const m = (v: number | null | undefined, digits = 2) =>
  v === null || v === undefined ? '–' : `${v.toFixed(digits)} m`;
const sec = (v: number | null | undefined) => (v === null || v === undefined ? '–' : `${v.toFixed(1)} s`);

function EventCard({ event, onOpen }: { event: SafetyEvent; onOpen: (t: number) => void }) {
  const gap = (event.localization_gap ?? 0) + (event.map_gap ?? 0);
  const share =
    gap > 0 && event.localization_gap !== null
      ? Math.max(0, Math.min(1, event.localization_gap / gap))
      : null;
  return (
    <li className="rounded border border-canvas-line p-2 text-xs" data-testid="safety-event">
      <div className="flex items-center justify-between gap-2">
        <button type="button" className="font-bold underline" onClick={() => onOpen(event.t)}>
          {event.kind} at {sec(event.t)}
        </button>
        <span className="rounded bg-canvas px-1" title="A suggestion: confirm or change it in the findings">
          Suggested: {CLASS_WORDS[event.suggested_class] ?? event.suggested_class}
        </span>
      </div>
      <p className="text-ink-muted">{event.reason}</p>
      <dl className="mt-1 grid grid-cols-2 gap-x-2 tabular-nums">
        <dt>Speed</dt>
        <dd>{event.speed === null ? '–' : `${event.speed.toFixed(2)} m/s`}</dd>
        <dt>Clearance had / believed</dt>
        <dd>
          {m(event.clearance)} / {m(event.clearance_believed)}
        </dd>
        <dt>Stopping distance</dt>
        <dd>{m(event.stopping_distance)}</dd>
        <dt>Stopping margin</dt>
        <dd>{m(event.margin)}</dd>
        <dt>Margin negative since</dt>
        <dd data-testid="margin-negative-since">
          {event.margin_negative_since === null ? (
            'not before the event'
          ) : (
            <button
              type="button"
              className="underline"
              onClick={() => onOpen(event.margin_negative_since as number)}
            >
              {sec(event.margin_negative_since)}
            </button>
          )}
        </dd>
        <dt>From localization error</dt>
        <dd data-testid="localization-share">
          {m(event.localization_gap)}
          {share !== null && ` (${Math.round(share * 100)} % of the gap)`}
        </dd>
        <dt>From what the map lacks</dt>
        <dd>{m(event.map_gap)}</dd>
        {event.separation && (
          <>
            <dt>S_p (ISO/TS 15066)</dt>
            <dd>
              {m(event.separation.total)}
              {event.separation.shortfall !== null &&
                event.separation.shortfall > 0 &&
                `, short by ${m(event.separation.shortfall)}`}
            </dd>
          </>
        )}
      </dl>
    </li>
  );
}

/** Separation and stopping: caution, minimum clearance, the events with suggested classes, the formulas. */
export function SafetyPanel({
  safety,
  step,
  onOpen,
}: {
  safety: SafetyReport | null | undefined;
  step: number;
  onOpen: (t: number) => void;
}) {
  const defaults = useMemo(() => {
    if (!safety) return null;
    const s = safety.series;
    return {
      speed: s.speed[step] ?? 0,
      reactionTime: safety.settings.reaction_time,
      deceleration: safety.settings.max_decel,
      brakingMargin: safety.settings.braking_margin,
      humanSpeed: safety.settings.human_speed,
      intrusion: safety.settings.intrusion,
      sensorUncertainty: safety.settings.sensor_uncertainty,
      robotUncertainty: s.position_uncertainty_95[step] ?? 0,
    };
  }, [safety, step]);
  if (safety === undefined)
    return <p className="text-sm text-ink-muted">Loading the separation and stopping analysis…</p>;
  if (safety === null || !defaults)
    return (
      <p className="text-sm text-ink-muted">
        This replay has no separation and stopping analysis (it was made before Driftcase had one). Run it
        again to get it.
      </p>
    );
  const minimum = safety.min_clearance;
  const s = safety.series;
  return (
    <div className="space-y-3" data-testid="safety-panel">
      <SafetyCautionNote
        text={`${safety.caution} These are engineering estimates from recorded data; the standards' formulas are shown for orientation only and must be checked against the current edition.`}
      />
      <p className="text-sm">
        Minimum clearance:{' '}
        {minimum ? (
          <button type="button" className="font-bold underline" onClick={() => onOpen(minimum.t)}>
            {m(minimum.value, 3)} at {sec(minimum.t)}
          </button>
        ) : (
          '–'
        )}
        {minimum && ` to the ${minimum.to}, ${minimum.basis} pose`}
      </p>
      <dl className="grid grid-cols-2 gap-x-2 text-xs tabular-nums" data-testid="safety-now">
        <dt>Now: speed</dt>
        <dd>{s.speed[step] === null ? '–' : `${(s.speed[step] as number).toFixed(2)} m/s`}</dd>
        <dt>Stopping distance</dt>
        <dd>{m(s.stopping_distance[step])}</dd>
        <dt>Clearance ahead</dt>
        <dd>{m(s.clearance_ahead[step])}</dd>
        <dt>Stopping margin</dt>
        <dd className={(s.stopping_margin[step] ?? 0) < 0 ? 'font-bold text-state-bad' : ''}>
          {m(s.stopping_margin[step])}
        </dd>
        <dt>Contact probability</dt>
        <dd>
          {s.contact_probability[step] === null ? '–' : (s.contact_probability[step] as number).toFixed(3)}
        </dd>
      </dl>
      <h3 className="text-sm font-bold">Safety events (classes are suggestions)</h3>
      {safety.events.length === 0 ? (
        <p className="text-xs text-ink-muted">No contact, stop or warning-field events are recorded.</p>
      ) : (
        <ul className="space-y-2">
          {safety.events.map((event) => (
            <EventCard key={`${event.kind}-${event.t}`} event={event} onOpen={onOpen} />
          ))}
        </ul>
      )}
      <h3 className="text-sm font-bold">Formulas and the values used</h3>
      <SeparationFormulasCard defaults={defaults} />
    </div>
  );
}

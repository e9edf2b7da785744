import {
  ISO_13855_EDITION,
  ISO_TS_15066_EDITION,
  minimumDistance,
  protectiveSeparationDistance,
} from '@shared/safety/separation-formulas';
import { stoppingDistance } from '@shared/safety/stopping-distance';
import { useEffect, useState } from 'react';

export interface FormulaDefaults {
  speed: number;
  reactionTime: number;
  deceleration: number;
  brakingMargin: number;
  humanSpeed: number;
  intrusion: number;
  sensorUncertainty: number;
  robotUncertainty: number;
}

function Term({
  label,
  unit,
  value,
  onChange,
}: {
  label: string;
  unit: string;
  value: number;
  onChange: (v: number) => void;
}) {
  return (
    <label className="flex items-center justify-between gap-2 text-xs">
      <span>{label}</span>
      <span className="flex items-center gap-1">
        <input
          type="number"
          step="any"
          value={Number.isFinite(value) ? value : ''}
          onChange={(e) => onChange(e.target.value === '' ? Number.NaN : Number(e.target.value))}
          className="w-20 rounded border border-canvas-line bg-canvas px-1 py-0.5 text-right tabular-nums"
        />
        <span className="w-9 text-ink-muted">{unit}</span>
      </span>
    </label>
  );
}

const m = (v: number, digits = 3) => (Number.isFinite(v) ? `${v.toFixed(digits)} m` : '–');

/**
 * The formulas with every term editable, starting from the values used at the current step, so an
 * investigator can see what a different reaction time or human speed would have needed.
 */
export function SeparationFormulasCard({ defaults }: { defaults: FormulaDefaults }) {
  const [terms, setTerms] = useState(defaults);
  const [device, setDevice] = useState({ stoppingPerformance: 0.32, detectionCapability: 14 });
  useEffect(() => setTerms(defaults), [defaults]);
  const set = (key: keyof FormulaDefaults) => (v: number) => setTerms((old) => ({ ...old, [key]: v }));
  const stop = stoppingDistance({
    speed: terms.speed,
    reactionTime: terms.reactionTime,
    deceleration: terms.deceleration,
    brakingMargin: terms.brakingMargin,
  });
  const separation = protectiveSeparationDistance({
    humanSpeed: terms.humanSpeed,
    robotSpeed: Math.abs(terms.speed),
    reactionTime: terms.reactionTime,
    stoppingTime: Math.abs(terms.speed) / terms.deceleration,
    stoppingDistance: stop.braking,
    intrusion: terms.intrusion,
    sensorUncertainty: terms.sensorUncertainty,
    robotUncertainty: terms.robotUncertainty,
  });
  const fixed = minimumDistance(device);
  return (
    <div className="space-y-3" data-testid="separation-formulas">
      <section className="space-y-1">
        <h4 className="text-xs font-bold">Stopping distance</h4>
        <p className="font-mono text-xs">d = v·t_r + v²/(2a), × (1 + margin)</p>
        <Term label="v, speed" unit="m/s" value={terms.speed} onChange={set('speed')} />
        <Term label="t_r, reaction time" unit="s" value={terms.reactionTime} onChange={set('reactionTime')} />
        <Term label="a, deceleration" unit="m/s²" value={terms.deceleration} onChange={set('deceleration')} />
        <Term label="braking margin" unit="×" value={terms.brakingMargin} onChange={set('brakingMargin')} />
        <p className="text-xs tabular-nums">
          d = {m(stop.base)} before margin, <b>{m(stop.total)}</b> with it. Common practice; the +10 % default
          margin is vendor practice with no single source.
        </p>
      </section>
      <section className="space-y-1">
        <h4 className="text-xs font-bold">Protective separation distance</h4>
        <p className="font-mono text-xs">S_p = v_h(T_r + T_s) + v_r·T_r + S_s + C + Z_d + Z_r</p>
        <p className="text-xs text-ink-muted">{ISO_TS_15066_EDITION}</p>
        <Term label="v_h, human speed" unit="m/s" value={terms.humanSpeed} onChange={set('humanSpeed')} />
        <Term label="C, intrusion" unit="m" value={terms.intrusion} onChange={set('intrusion')} />
        <Term
          label="Z_d, sensor uncertainty"
          unit="m"
          value={terms.sensorUncertainty}
          onChange={set('sensorUncertainty')}
        />
        <Term
          label="Z_r, robot position (95 %)"
          unit="m"
          value={terms.robotUncertainty}
          onChange={set('robotUncertainty')}
        />
        <p className="text-xs tabular-nums">
          S_p = <b>{m(separation.total)}</b>. Z_r comes from the replay's belief: this is where localization
          error becomes a separation shortfall.
        </p>
      </section>
      <section className="space-y-1">
        <h4 className="text-xs font-bold">Minimum distance of a fixed protective device</h4>
        <p className="font-mono text-xs">S = K·T + C, C = 8(d − 14) mm</p>
        <p className="text-xs text-ink-muted">{ISO_13855_EDITION}</p>
        <Term
          label="T, stopping performance"
          unit="s"
          value={device.stoppingPerformance}
          onChange={(v) => setDevice((old) => ({ ...old, stoppingPerformance: v }))}
        />
        <Term
          label="d, detection capability"
          unit="mm"
          value={device.detectionCapability}
          onChange={(v) => setDevice((old) => ({ ...old, detectionCapability: v }))}
        />
        <p className="text-xs tabular-nums">
          K = {fixed.approachSpeed} mm/s: S ={' '}
          <b>{Number.isFinite(fixed.distance) ? fixed.distance.toFixed(0) : '–'} mm</b>
          {fixed.approachSpeed === 1600 && ` (${fixed.distanceAtK2000.toFixed(0)} mm with K = 2000 mm/s)`}.
        </p>
      </section>
    </div>
  );
}

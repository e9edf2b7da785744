import type { Bundle, PoseColumns } from '../../../../shared/bundle/types';
import {
  countOf,
  EVENT_KIND_LABELS,
  FLAG_KIND_LABELS,
  FLAG_SEVERITY_LABELS,
  labelFor,
} from '../../../../shared/human-labels';
import type { CaseEvidence } from '../collect-case-evidence';
import { renderCausesSection } from './causes-section';
import { renderMapPictureSvg } from './map-picture-svg';
import { escapeHtml, formatNumber, SERIES_COLOURS } from './report-colours';
import type { ReportText } from './report-text';
import { renderSafetySection } from './safety-section';
import { renderTimelineSvg } from './timeline-svg';

type ReplayEvidence = CaseEvidence['replays'][number];

/** Map pictures per replay: the first few flagged moments tell the story; more would bury it. */
const MAX_MAP_PICTURES = 3;

function nearestIndex(times: ArrayLike<number | null>, t: number): number {
  let best = 0;
  for (let i = 0; i < times.length; i++) {
    const value = times[i];
    if (value !== null && Math.abs(value - t) < Math.abs((times[best] ?? Number.POSITIVE_INFINITY) - t))
      best = i;
  }
  return best;
}

function poseAt(table: PoseColumns | undefined, t: number) {
  if (!table || table.t.length === 0) return null;
  const i = nearestIndex(table.t, t);
  return { x: table.x[i], y: table.y[i], theta: table.theta[i] };
}

function mapPictures(entry: ReplayEvidence, bundle: Bundle | null): string {
  const grid = bundle?.map.grid;
  if (!bundle || !grid || entry.result.flags.length === 0) return '';
  const { t, x, y, theta } = entry.series;
  const figures = entry.result.flags.slice(0, MAX_MAP_PICTURES).map((flag) => {
    const step = nearestIndex(t, flag.start);
    const trajectory: { x: number; y: number }[] = [];
    const every = Math.max(1, Math.ceil(step / 600));
    for (let i = 0; i <= step; i += every) {
      if (x[i] !== null && y[i] !== null) trajectory.push({ x: x[i] as number, y: y[i] as number });
    }
    const replay =
      x[step] === null ? null : { x: x[step] as number, y: y[step] as number, theta: theta[step] ?? 0 };
    const caption = `${labelFor(FLAG_KIND_LABELS, flag.kind)} at ${formatNumber(flag.start, 1)} s (step ${step})`;
    const svg = renderMapPictureSvg({
      grid,
      caption,
      trajectory,
      replay,
      reference: poseAt(bundle.reference, flag.start),
      onboard: poseAt(bundle.onboard, flag.start),
    });
    return `<figure>${svg}<figcaption>${escapeHtml(caption)}</figcaption></figure>`;
  });
  return `<h4>Map at the flagged moments</h4><p class="legend"><span><i class="swatch" style="background:${SERIES_COLOURS.replay}"></i>replay mean pose and trajectory</span><span><i class="swatch" style="background:${SERIES_COLOURS.reference}"></i>reference pose</span><span><i class="swatch" style="background:${SERIES_COLOURS.onboard}"></i>onboard pose</span></p><div class="maps">${figures.join('')}</div>`;
}

/** One replay: settings, digest, RMSE, the ESS and error timelines, flags with evidence, map pictures. */
export function renderReplaySection(entry: ReplayEvidence, bundle: Bundle | null, text: ReportText): string {
  const { replay, result, series } = entry;
  const settings = result.settings;
  const particles = series.particles ?? [];
  const essFraction = (series.ess ?? []).map((ess, i) =>
    ess === null || !particles[i] ? null : ess / (particles[i] as number),
  );
  // The charts' hover titles read the kinds in words, like every other text of the report.
  const flags = result.flags.map((f) => ({
    start: f.start,
    end: f.end,
    kind: labelFor(FLAG_KIND_LABELS, f.kind),
  }));
  const events = bundle?.events
    ? Array.from(bundle.events.t, (t, i) => ({
        t,
        kind: labelFor(EVENT_KIND_LABELS, bundle.events?.kind[i]),
      }))
    : [];
  const essChart = renderTimelineSvg({
    title: 'Effective sample size',
    yLabel: 'fraction of particles',
    t: series.t,
    lines: [{ label: 'ESS / N', values: essFraction, colour: SERIES_COLOURS.replay }],
    flags,
    events,
  });
  const errorChart = renderTimelineSvg({
    title: 'Position error of the replay',
    yLabel: 'm',
    t: series.t,
    lines: [
      { label: 'vs reference', values: series.error_reference ?? [], colour: SERIES_COLOURS.reference },
      { label: 'vs onboard', values: series.error_onboard ?? [], colour: SERIES_COLOURS.onboard },
    ],
    flags,
    events,
  });
  const flagRows = result.flags
    .map(
      (f) =>
        `<tr><td>${escapeHtml(labelFor(FLAG_KIND_LABELS, f.kind))}</td><td>${escapeHtml(FLAG_SEVERITY_LABELS[f.severity])}</td><td>${formatNumber(f.start, 1)}–${formatNumber(f.end, 1)} <span class="unit">s</span></td><td>${escapeHtml(f.evidence)}</td></tr>`,
    )
    .join('');
  return `<section><h3>Replay ${escapeHtml(replay.label || replay.id)}</h3>
<table><tbody>
<tr><th>Replay id</th><td class="hash">${escapeHtml(replay.id)}</td></tr>
<tr><th>Started</th><td>${text.time(replay.createdAt)} by ${escapeHtml(replay.createdBy.name)}</td></tr>
<tr><th>Bundle SHA-256</th><td class="hash">${escapeHtml(entry.bundleSha256)}</td></tr>
<tr><th>Settings</th><td>${settings.particles} particles, seed ${settings.seed}, resampling ${escapeHtml(settings.resampling.method)} below ESS ${formatNumber(settings.resampling.threshold, 2)} N; overrides ${escapeHtml(JSON.stringify(replay.overrides))}</td></tr>
<tr><th>Digest</th><td class="hash">${escapeHtml(result.digest)}</td></tr>
<tr><th>Engine</th><td>${result.engine ? `engine ${escapeHtml(result.engine.engine)}, digest layout ${result.engine.digestLayout}, ${escapeHtml(result.engine.runtime)}` : 'engine 1.x, digest layout 1 (no engine stamp recorded)'}</td></tr>
<tr><th>RMSE</th><td>${formatNumber(result.metrics.rmse_reference, 3)} <span class="unit">m vs reference</span>; ${formatNumber(result.metrics.rmse_onboard, 3)} <span class="unit">m vs onboard</span></td></tr>
<tr><th>Diverged at</th><td>${result.metrics.diverged_at === null ? 'never' : `${formatNumber(result.metrics.diverged_at, 1)} <span class="unit">s</span>`}</td></tr>
</tbody></table>
<figure>${essChart}<figcaption>Shaded: flag intervals. Ticks on the time axis: recorded events.</figcaption></figure>
<figure>${errorChart}<figcaption><span style="color:${SERIES_COLOURS.reference}">reference</span> and <span style="color:${SERIES_COLOURS.onboard}">onboard</span> error; shaded: flags.</figcaption></figure>
${result.flags.length ? `<p>${countOf(result.flags.length, 'flag')} raised.</p><table><thead><tr><th>Flag</th><th>Severity</th><th>When</th><th>Evidence</th></tr></thead><tbody>${flagRows}</tbody></table>` : '<p>No flags were raised.</p>'}
${renderCausesSection(entry.causes)}
${entry.safety ? renderSafetySection(entry.safety, events) : '<p>No separation and stopping analysis: this replay was made before Driftcase had one; run it again to get it.</p>'}
${mapPictures(entry, bundle)}
</section>`;
}

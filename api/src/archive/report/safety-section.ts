import { EVENT_KIND_LABELS, labelFor } from '../../../../shared/human-labels';
import type { SafetyEvent, SafetyReport } from '../../../../shared/safety/safety-report';
import { ISO_13855_EDITION, ISO_TS_15066_EDITION } from '../../../../shared/safety/separation-formulas';
import { escapeHtml, formatNumber, SERIES_COLOURS } from './report-colours';
import { renderTimelineSvg } from './timeline-svg';

const CLASS_WORDS: Record<string, string> = {
  contact: 'Contact',
  near_miss: 'Near miss',
  no_hazard: 'No hazard',
};

const metres = (value: number | null | undefined, digits = 2) =>
  value === null || value === undefined ? '–' : `${formatNumber(value, digits)} <span class="unit">m</span>`;
const seconds = (value: number | null | undefined) =>
  value === null || value === undefined ? '–' : `${formatNumber(value, 1)} <span class="unit">s</span>`;

function eventRow(event: SafetyEvent): string {
  const separation = event.separation
    ? `${metres(event.separation.total)} (short by ${metres(event.separation.shortfall)})`
    : '–';
  return `<tr><td>${seconds(event.t)}</td><td>${escapeHtml(labelFor(EVENT_KIND_LABELS, event.kind))}</td><td><b>${escapeHtml(CLASS_WORDS[event.suggested_class] ?? event.suggested_class)}</b> (suggested)<br><small>${escapeHtml(event.reason)}</small></td><td>${metres(event.speed)}/s</td><td>${metres(event.clearance)}</td><td>${metres(event.clearance_believed)}</td><td>${metres(event.stopping_distance)}</td><td>${metres(event.margin)}</td><td>${seconds(event.margin_negative_since)}</td><td>${metres(event.localization_gap)} / ${metres(event.map_gap)}</td><td>${separation}</td></tr>`;
}

/**
 * The separation and stopping analysis of one replay: caution first, the minimum clearance, the
 * events with their suggested classes, the clearance and stopping-margin timelines and the
 * formulas with the values used. The same numbers as the workspace and safety.json.
 */
export function renderSafetySection(
  safety: SafetyReport,
  events: readonly { t: number; kind: string }[],
): string {
  const { series, settings } = safety;
  const clearanceChart = renderTimelineSvg({
    title: 'Clearance: had (reference pose, map and scans) and believed (onboard pose, map)',
    yLabel: 'm',
    t: safety.t,
    lines: [
      {
        label: 'had',
        values: series.clearance_reference.some((v) => v !== null)
          ? series.clearance_reference
          : series.clearance_replay,
        colour: SERIES_COLOURS.reference,
      },
      { label: 'believed', values: series.clearance_onboard, colour: SERIES_COLOURS.onboard },
    ],
    flags: [],
    events,
    yCap: 2,
  });
  const marginChart = renderTimelineSvg({
    title: 'Stopping margin: clearance ahead minus stopping distance',
    yLabel: 'm, below the dashed line the robot could not have stopped in time',
    t: safety.t,
    lines: [{ label: 'margin', values: series.stopping_margin, colour: SERIES_COLOURS.flag }],
    flags: [],
    events,
    yCap: 2,
  });
  const minimum = safety.min_clearance;
  const device = safety.minimum_distance;
  return `<h4>Separation and stopping</h4>
<p class="caution" role="note">⚠ ${escapeHtml(safety.caution)} The standards' formulas below are shown for orientation only and must be checked against the current edition. Classes are suggestions; the investigator confirms or changes them in the findings.</p>
<table><tbody>
<tr><th>Minimum clearance</th><td>${minimum ? `${metres(minimum.value, 3)} at ${seconds(minimum.t)} to the ${escapeHtml(minimum.to)}, from the ${escapeHtml(minimum.basis)} pose` : 'not measurable (no map grid or scans)'}</td></tr>
<tr><th>Stopping distance</th><td>d = v·t<sub>r</sub> + v²/(2a), plus ${formatNumber(settings.braking_margin * 100, 0)} % braking margin (vendor practice, no single source); t<sub>r</sub> = ${formatNumber(settings.reaction_time, 2)} s, a = ${formatNumber(settings.max_decel, 2)} m/s² (manifest)</td></tr>
<tr><th>Protective separation</th><td>S<sub>p</sub> = v<sub>h</sub>(T<sub>r</sub> + T<sub>s</sub>) + v<sub>r</sub>T<sub>r</sub> + S<sub>s</sub> + C + Z<sub>d</sub> + Z<sub>r</sub> (${escapeHtml(ISO_TS_15066_EDITION)}); v<sub>h</sub> = ${formatNumber(settings.human_speed, 2)} m/s, C = ${formatNumber(settings.intrusion, 2)} m, Z<sub>d</sub> = ${formatNumber(settings.sensor_uncertainty, 2)} m, Z<sub>r</sub> = the replay belief's 95 % radius at the event</td></tr>
<tr><th>Fixed protective device</th><td>${device ? `S = K·T + C (${escapeHtml(ISO_13855_EDITION)}): ${escapeHtml(device.device)}, T = ${formatNumber(device.stopping_performance, 3)} s, d = ${formatNumber(device.detection_capability_mm, 0)} mm, K = ${device.approach_speed_mm_s} mm/s, S = ${formatNumber(device.distance_mm, 0)} mm` : 'none described in the manifest'}</td></tr>
</tbody></table>
<figure>${clearanceChart}<figcaption><span style="color:${SERIES_COLOURS.reference}">had</span> and <span style="color:${SERIES_COLOURS.onboard}">believed</span> clearance; ticks: recorded events.</figcaption></figure>
<figure>${marginChart}<figcaption>Stopping margin with the robot's own speed, reaction time and deceleration.</figcaption></figure>
${safety.events.length ? `<table><thead><tr><th>When</th><th>Event</th><th>Class</th><th>Speed</th><th>Clearance had</th><th>Believed</th><th>Stopping distance</th><th>Margin</th><th>Margin negative since</th><th>Localization / map gap</th><th>S<sub>p</sub></th></tr></thead><tbody>${safety.events.map(eventRow).join('')}</tbody></table>` : '<p>No contact, stop or warning-field events are recorded.</p>'}`;
}

import { CASE_STAGE_LABELS } from '../../../../shared/case-path';
import type { TCasePath } from '../../../../shared/contracts/cases';
import { ROLE_LABELS } from '../../../../shared/human-labels';
import type { Role } from '../../../../shared/roles';
import { formatSiteDate, formatSiteDateTime } from '../../../../shared/site-time';
import { escapeHtml } from './report-colours';

/**
 * report.html's way of writing times and the case path: the site's zone, named beside every time,
 * as in the web app; the machine-readable RFC 3339 value stays in each `<time datetime>`.
 */
export function createReportText(zone: string) {
  const time = (iso: string | null | undefined, options: { withSeconds?: boolean } = {}): string =>
    iso
      ? `<time datetime="${escapeHtml(iso)}">${escapeHtml(formatSiteDateTime(iso, zone, options))}</time>`
      : '—';

  const holders = (roles: readonly string[]) =>
    roles.length === 0 ? 'nobody' : roles.map((role) => ROLE_LABELS[role as Role] ?? role).join(' or ');

  /** The six stages as stations (shape per state, so it prints in greyscale), then where it stands. */
  const casePath = (path: TCasePath): string => {
    const stations = path.stages
      .map(
        (stage) =>
          `<li class="station ${stage.state}"><span class="dot" aria-hidden="true"></span><b>${escapeHtml(CASE_STAGE_LABELS[stage.stage])}</b><span>${stage.at ? escapeHtml(formatSiteDate(stage.at, zone)) : { done: 'reached', now: 'next', todo: 'not reached', skipped: 'not needed' }[stage.state]}</span></li>`,
      )
      .join('');
    return `<ol class="path" aria-label="Case path">${stations}</ol><p class="standing"><b>${escapeHtml(path.summary)}</b> · held by <b>${escapeHtml(holders(path.holders))}</b> since ${time(path.since)}</p>`;
  };

  return { time, casePath, zone };
}

export type ReportText = ReturnType<typeof createReportText>;

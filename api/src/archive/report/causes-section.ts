import { CAUSES_CAUTION } from '../../../../shared/causes-caution';
import type { TProbableCause } from '../../../../shared/contracts/replays';
import { CAUSE_KIND_LABELS, labelFor } from '../../../../shared/human-labels';
import { escapeHtml, formatNumber } from './report-colours';

function counterfactualList(runs: TProbableCause['counterfactuals']): string {
  if (runs.length === 0) return 'none run';
  const items = runs.map(
    (run) =>
      `<li>${run.supports ? '<span class="ok">✓ supports</span>' : '<span class="bad">✗ does not support</span>'} ${escapeHtml(run.label)}: ${escapeHtml(run.metric)} ${formatNumber(run.value, 3)}<br><span class="unit">digest</span> <span class="hash">${escapeHtml(run.digest)}</span></li>`,
  );
  return `<ul>${items.join('')}</ul>`;
}

/**
 * A replay's probable causes as the workspace shows them, each with the counterfactual replays
 * (and their digests, so they can be re-run) that speak for or against it, under the caution.
 */
export function renderCausesSection(causes: readonly TProbableCause[] | null): string {
  if (causes === null)
    return '<p>No probable causes: this replay was made before Driftcase ranked them; run it again to get them.</p>';
  const caution = `<p class="caution" role="note">⚠ ${escapeHtml(CAUSES_CAUTION)}</p>`;
  if (causes.length === 0) return `<h4>Probable causes</h4>${caution}<p>No candidate cause was found.</p>`;
  const rows = causes.map(
    (cause) =>
      `<tr><td><b>${escapeHtml(labelFor(CAUSE_KIND_LABELS, cause.kind))}</b></td><td>${formatNumber(cause.start, 1)}–${formatNumber(cause.end, 1)} <span class="unit">s</span></td><td>${formatNumber(cause.confidence, 2)}</td><td>${escapeHtml(cause.evidence)}${cause.against ? `<br><small>Against: ${escapeHtml(cause.against)}</small>` : ''}</td><td>${counterfactualList(cause.counterfactuals)}</td></tr>`,
  );
  return `<h4>Probable causes</h4>${caution}<table><thead><tr><th>Cause</th><th>When</th><th>Confidence</th><th>Evidence</th><th>Counterfactual replays</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

import { figureFilePath } from '../../../../shared/archive/archive-layout';
import { verifyAuditChain } from '../../../../shared/audit-chain';
import type { Bundle } from '../../../../shared/bundle/types';
import {
  CAUSE_CATEGORY_LABELS,
  INCIDENT_CLASS_LABELS,
  type TEvidenceItem,
} from '../../../../shared/contracts/findings';
import { EVIDENCE_TYPE_LABELS, type EvidenceNames, nameEvidence } from '../../../../shared/evidence-names';
import {
  AUDIT_ACTION_LABELS,
  BUNDLE_STATUS_LABELS,
  countOf,
  FINDINGS_VERSION_STATE_LABELS,
  labelFor,
  RECORDING_FILE_LABELS,
  SEVERITY_LABELS,
} from '../../../../shared/human-labels';
import { ROLE_LABELS } from '../../../../shared/roles';
import { renderSeverityMarkSvg } from '../../../../shared/severity-mark';
import { describeTimeZone } from '../../../../shared/site-time';
import type { CaseEvidence } from '../collect-case-evidence';
import { evidenceNamesOf } from './evidence-names-of';
import { renderReplaySection } from './replay-section';
import { REPORT_BRAND_MARK } from './report-brand';
import { escapeHtml } from './report-colours';
import { reportStyles } from './report-styles';
import { createReportText, type ReportText } from './report-text';

export interface ReportInput {
  evidence: CaseEvidence;
  /** Parsed bundles by SHA-256 for timelines and maps; null when too large or invalid. */
  bundles: ReadonlyMap<string, Bundle | null>;
  productVersion: string;
  safetyCaution: string;
  /** RFC 7638 thumbprint of the key that signs this archive's manifest. */
  signingKeyThumbprint: string;
  /** IANA zone the report shows times in, named beside each (`SITE_TIME_ZONE`). */
  siteTimeZone: string;
  /** Each saved figure's picture as a data: URL by figure id, so the report shows it without the network. */
  figurePictures: ReadonlyMap<string, string>;
}

const row = (label: string, value: string) => `<tr><th>${escapeHtml(label)}</th><td>${value}</td></tr>`;

function findingsSection(
  evidence: CaseEvidence,
  text: ReportText,
  pictures: ReadonlyMap<string, string>,
): string {
  const latestSigned = [...evidence.findings].reverse().find((v) => v.signature);
  const shown = latestSigned ?? evidence.findings.at(-1);
  if (!shown) return '<p>No findings have been submitted.</p>';
  const status = shown.signature
    ? shown.signature.valid
      ? `<span class="ok">✓ Signature valid</span> — signed by ${escapeHtml(shown.signature.signedBy)} on ${text.time(shown.signature.signedAt, { withSeconds: true })} (key ${escapeHtml(shown.signature.kid)})`
      : `<span class="bad">✗ Signature invalid</span>: ${escapeHtml(shown.signature.error)}`
    : '<span class="bad">✗ Not signed</span>';
  const c = shown.content;
  const causes = c.contributingFactors
    .map((f) => `<li>${escapeHtml(CAUSE_CATEGORY_LABELS[f.category])}: ${escapeHtml(f.text)}</li>`)
    .join('');
  const actions = c.correctiveActions
    .map(
      (a) => `<li>${escapeHtml(a.description)} — ${escapeHtml(a.owner)}, due ${escapeHtml(a.dueDate)}</li>`,
    )
    .join('');
  const versions = evidence.findings
    .map(
      (v) =>
        `<tr><td>${v.version}</td><td>${escapeHtml(FINDINGS_VERSION_STATE_LABELS[v.state])}</td><td>${escapeHtml(v.author.name)}</td><td>${text.time(v.submittedAt)}</td><td class="hash">${escapeHtml(v.sha256)}</td></tr>`,
    )
    .join('');
  return `<p>Version ${shown.version} by ${escapeHtml(shown.author.name)}, submitted ${text.time(shown.submittedAt)}. ${status}</p>
<table><tbody>${row('Incident class', escapeHtml(INCIDENT_CLASS_LABELS[c.incidentClass]))}${row('Summary', escapeHtml(c.summary))}${row('Root cause', `${escapeHtml(CAUSE_CATEGORY_LABELS[c.rootCause.category])}: ${escapeHtml(c.rootCause.text)}`)}${row('Contributing factors', causes ? `<ul>${causes}</ul>` : 'None given')}${row('Corrective actions', actions ? `<ul>${actions}</ul>` : 'None given')}</tbody></table>
<h3>Evidence cited (${countOf(c.evidence.length, 'item')})</h3>${citedEvidenceList(c.evidence, evidenceNamesOf(evidence), pictures)}
<h3>All versions</h3><table><thead><tr><th>Version</th><th>State</th><th>Author</th><th>Submitted</th><th>SHA-256</th></tr></thead><tbody>${versions}</tbody></table>
<h3>Reviewers' comments</h3>${reviewsList(evidence, text)}`;
}

/** Every cited item by name, with the hash it stores and the investigator's note. */
function citedEvidenceList(
  items: readonly TEvidenceItem[],
  names: EvidenceNames,
  pictures: ReadonlyMap<string, string>,
): string {
  if (items.length === 0) return '<p>None.</p>';
  const entries = items.map((item) => {
    const named = nameEvidence(item, names);
    const hash = named.hash
      ? `<br><span class="unit">${escapeHtml(named.hash.label)}</span> <span class="hash">${escapeHtml(named.hash.value)}</span>`
      : '';
    const note = item.note ? `<br>${escapeHtml(item.note)}` : '';
    const picture = item.type === 'figure' ? figurePicture(item, pictures) : '';
    return `<li><strong>${escapeHtml(EVIDENCE_TYPE_LABELS[item.type])}: ${escapeHtml(named.name)}</strong> — ${escapeHtml(named.detail)}${hash}${note}${picture}</li>`;
  });
  return `<ol class="cited">${entries.join('')}</ol>`;
}

/** A cited figure shown inline, linked to its file in the archive. */
function figurePicture(
  item: Extract<TEvidenceItem, { type: 'figure' }>,
  pictures: ReadonlyMap<string, string>,
): string {
  const source = pictures.get(item.figureId);
  return source
    ? `<br><img class="figure" src="${escapeHtml(source)}" alt="Cited figure ${escapeHtml(item.sha256.slice(0, 12))}">`
    : '';
}

/** Every picture saved to the case, with the path of its file inside this archive. */
function figuresTable(evidence: CaseEvidence): string {
  if (evidence.figures.length === 0) return '';
  const rows = evidence.figures
    .map(({ figure }) => {
      const file = figureFilePath(figure.sha256, figure.fileName);
      return `<tr><td>${escapeHtml(figure.caption)}</td><td><a href="${escapeHtml(file)}">${escapeHtml(file)}</a></td><td>${figure.sizeBytes.toLocaleString('en-US')} <span class="unit">bytes</span></td><td class="hash">${escapeHtml(figure.sha256)}</td></tr>`;
    })
    .join('');
  return `<h3>Figures saved to the case</h3><table><thead><tr><th>Caption</th><th>File in this archive</th><th>Size</th><th>SHA-256</th></tr></thead><tbody>${rows}</tbody></table>`;
}

/** Each review of each version in order, with the comment a reviewer returned it with. */
function reviewsList(evidence: CaseEvidence, text: ReportText): string {
  const rows = evidence.findings.flatMap((version) =>
    version.reviews.map(
      (review) =>
        `<tr><td>${version.version}</td><td>${review.kind === 'signoff' ? 'Signed' : 'Returned with comments'}</td><td>${escapeHtml(review.reviewer.name)}</td><td>${text.time(review.at)}</td><td>${review.comment ? escapeHtml(review.comment) : '—'}</td></tr>`,
    ),
  );
  if (rows.length === 0) return '<p>No version has been reviewed yet.</p>';
  return `<table><thead><tr><th>Version</th><th>Review</th><th>Reviewer</th><th>When</th><th>Comment</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function fixesSection(evidence: CaseEvidence, text: ReportText): string {
  if (evidence.fixes.length === 0) return '<p>No fixes are linked.</p>';
  const digests = new Map(evidence.replays.map((r) => [r.replay.id, r.result]));
  return `<table><thead><tr><th>Fix</th><th>Link</th><th>Verification replay</th><th>Verified</th></tr></thead><tbody>${evidence.fixes
    .map((fix) => {
      const replay = fix.verificationReplayId ? digests.get(fix.verificationReplayId) : undefined;
      return `<tr><td>${escapeHtml(fix.description)}<br><span class="unit">linked by ${escapeHtml(fix.linkedBy.name)} on ${text.time(fix.linkedAt)}</span></td><td class="hash">${escapeHtml(fix.url ?? '')} ${escapeHtml(fix.commitId ?? '')}</td><td>${fix.verificationReplayId ? `<span class="hash">${escapeHtml(fix.verificationReplayId)}</span>${replay ? `<br>${countOf(replay.flags.length, 'flag')}, RMSE ${replay.metrics.rmse_reference?.toFixed(3) ?? '–'} m` : ''}` : 'Not linked'}</td><td>${fix.verifiedAt ? `<span class="ok">✓</span> ${escapeHtml(fix.verifiedBy?.name)} on ${text.time(fix.verifiedAt)}${fix.isVerifiedWithoutImprovement ? ', confirmed although the replay showed no improvement' : ''}${fix.verificationComment ? `<br>“${escapeHtml(fix.verificationComment)}”` : ''}` : 'not yet'}</td></tr>`;
    })
    .join('')}</tbody></table>`;
}

function custodySection(evidence: CaseEvidence, text: ReportText): string {
  const exports = evidence.auditChain.filter((e) => e.action === 'archive.export');
  const chain = verifyAuditChain(evidence.auditChain);
  const counts = new Map<string, number>();
  for (const entry of evidence.auditChain) counts.set(entry.action, (counts.get(entry.action) ?? 0) + 1);
  const exportRows = exports
    .map(
      (e) =>
        `<tr><td>${text.time(e.at, { withSeconds: true })}</td><td>${escapeHtml(e.actorEmail)}</td><td class="hash">${escapeHtml(e.details.sha256)}</td></tr>`,
    )
    .join('');
  const actionRows = [...counts.entries()]
    .map(([action, n]) => [labelFor(AUDIT_ACTION_LABELS, action), action, n] as const)
    .sort(([a], [b]) => a.localeCompare(b))
    .map(
      ([label, action, n]) =>
        `<tr><td title="${escapeHtml(action)}">${escapeHtml(label)}</td><td>${n}</td></tr>`,
    )
    .join('');
  return `<h3>Earlier exports</h3>${exports.length ? `<table><thead><tr><th>When</th><th>Who</th><th>Archive SHA-256</th></tr></thead><tbody>${exportRows}</tbody></table>` : '<p>This is the first export of the case.</p>'}
<h3>Audit trail</h3><p>${countOf(evidence.auditChain.length, 'entry', 'entries')}; hash chain ${chain.ok ? '<span class="ok">✓ intact</span>' : `<span class="bad">✗ broken at entry ${chain.firstBroken?.chainSeq}: ${escapeHtml(chain.firstBroken?.reason)}</span>`}. Last entry hash <span class="hash">${escapeHtml(evidence.auditChain.at(-1)?.entryHash ?? 'no entries yet')}</span>.</p>
<table><thead><tr><th>Action</th><th>Entries</th></tr></thead><tbody>${actionRows}</tbody></table>
<h3>Audit trail in order</h3><table><thead><tr><th>#</th><th>When</th><th>Who</th><th>Role</th><th>What</th></tr></thead><tbody>${evidence.auditChain
    .map(
      (e) =>
        `<tr><td>${e.chainSeq}</td><td>${text.time(e.at, { withSeconds: true })}</td><td>${escapeHtml(e.actorEmail ?? 'the system')}</td><td>${escapeHtml(e.actorRole ? labelFor(ROLE_LABELS, e.actorRole) : '—')}</td><td title="${escapeHtml(e.action)}">${escapeHtml(labelFor(AUDIT_ACTION_LABELS, e.action))}</td></tr>`,
    )
    .join('')}</tbody></table>`;
}

/**
 * The archive's self-contained report.html: no network requests (fonts, pictures and charts are
 * inline). It holds only recorded facts, never the export time, so an unchanged case renders the
 * same bytes.
 */
export function renderReport(input: ReportInput): string {
  const { evidence } = input;
  const c = evidence.caseRecord;
  const text = createReportText(input.siteTimeZone);
  const bundleRows = evidence.bundles
    .map(
      ({ record }) =>
        `<tr><td>${escapeHtml(record.originalName)}</td><td>${escapeHtml(BUNDLE_STATUS_LABELS[record.status])}</td><td>${record.sizeBytes.toLocaleString('en-US')} <span class="unit">bytes</span></td><td class="hash">${escapeHtml(record.sha256)}</td></tr>`,
    )
    .join('');
  const recordingRows = evidence.recordingOriginals
    .map(
      (original) =>
        `<tr><td>${escapeHtml(original.name)}</td><td>${escapeHtml(labelFor(RECORDING_FILE_LABELS, original.role))}</td><td>${original.sizeBytes.toLocaleString('en-US')} <span class="unit">bytes</span></td><td class="hash">${escapeHtml(original.sha256)}</td><td>${original.bundleSha256 ? `<span class="hash">${escapeHtml(original.bundleSha256)}</span>` : 'could not be read'}</td></tr>`,
    )
    .join('');
  const recordings = recordingRows
    ? `<h3>Robot recording originals</h3><table><thead><tr><th>File</th><th>Role</th><th>Size</th><th>SHA-256</th><th>Read into bundle</th></tr></thead><tbody>${recordingRows}</tbody></table>`
    : '';
  const replays = evidence.replays
    .map((entry) => renderReplaySection(entry, input.bundles.get(entry.bundleSha256) ?? null, text))
    .join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Evidence report ${escapeHtml(c.reference)}</title><style>${reportStyles()}</style></head><body>
<header class="brand"><div class="brand-line">${REPORT_BRAND_MARK}<span class="wordmark">Drift<span>case</span></span><span class="kind">Evidence report</span></div><h1><span class="ref">${escapeHtml(c.reference)}</span> ${escapeHtml(c.title)}</h1></header>
<p class="caution" role="note">⚠ ${escapeHtml(input.safetyCaution)}</p>
<section><h2>Case</h2>${text.casePath(c.path)}<table><tbody>${row('Reference', escapeHtml(c.reference))}${row('Site', escapeHtml(c.site))}${row('Robot', escapeHtml(c.robotId))}${row('Incident time', text.time(c.incidentTime))}${row('Severity', `<span class="severity">${renderSeverityMarkSvg(c.severity, 18)} ${escapeHtml(SEVERITY_LABELS[c.severity])}</span>`)}${row('Summary', escapeHtml(c.summary || '—'))}${row('Product version', escapeHtml(input.productVersion))}</tbody></table></section>
<section><h2>Recorded evidence</h2>${bundleRows ? `<table><thead><tr><th>Bundle</th><th>Validation</th><th>Size</th><th>SHA-256</th></tr></thead><tbody>${bundleRows}</tbody></table>` : '<p>No bundles.</p>'}${recordings}${figuresTable(evidence)}</section>
<section><h2>Replays and flags</h2>${replays ? `${REPLAY_RERUN_NOTE}${replays}` : '<p>No finished replays.</p>'}</section>
<section><h2>Findings</h2>${findingsSection(evidence, text, input.figurePictures)}</section>
<section><h2>Fixes and verification</h2>${fixesSection(evidence, text)}</section>
<section><h2>Custody</h2>${custodySection(evidence, text)}</section>
<section><h2>Signing key</h2><p>This archive is signed with the key whose RFC 7638 thumbprint is <code class="thumbprint">${escapeHtml(input.signingKeyThumbprint)}</code>. Compare it with the thumbprint your site publishes outside Driftcase: a key found only inside the archive proves nothing, since whoever edits an archive can replace it.</p></section>
<footer><p class="unit">Times are shown in ${escapeHtml(describeTimeZone(input.siteTimeZone, new Date(c.incidentTime)))}, the site's time zone; the archive's JSON files keep every time in RFC 3339.</p><p class="unit">Check this archive offline: <code>npm run cli -- verify-archive FILE.zip --trusted-thumbprint ${escapeHtml(input.signingKeyThumbprint)}</code> checks every file against manifest.json, the signatures against that trusted key, the audit chain and its checkpoints, and re-runs every replay from the included original bundle.</p></footer>
</body></html>
`;
}

/** How to confirm the digests independently, on any machine or in a browser. */
const REPLAY_RERUN_NOTE = `<p>Every digest below can be re-confirmed independently: offline, <code>npm run cli -- verify-archive FILE.zip</code> re-runs each replay from <code>bundles/&lt;sha256&gt;/original.zip</code> with <code>replays/&lt;id&gt;/settings.json</code> and compares the result with <code>replays/&lt;id&gt;/digest</code> (exit 0: all match). The replay engine computes its own elementary functions, so the same engine version gives the same digest on any JavaScript engine; in the Driftcase workspace, <em>Re-run in this browser</em> does the same for a replay without the server. A digest recorded by an older engine (a lower digest layout, shown under Engine) is reported as <code>OLD</code>, not comparable rather than tampered, and verify-archive exits 3.</p>`;

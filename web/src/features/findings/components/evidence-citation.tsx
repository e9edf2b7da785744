import type { TEvidenceItem } from '@shared/contracts/findings';

export const EVIDENCE_TYPE_LABELS: Record<TEvidenceItem['type'], string> = {
  replay: 'Replay',
  bookmark: 'Bookmark',
  saved_query: 'Saved query',
  bundle_file: 'Bundle file',
};

/** The identity and hash a citation carries, so a reader can check it against the evidence. */
export function EvidenceCitation({ item }: { item: TEvidenceItem }) {
  const [reference, hashLabel, hash] =
    item.type === 'replay'
      ? [`replay ${item.replayId}`, 'digest', item.digest]
      : item.type === 'bookmark'
        ? [`bookmark ${item.bookmarkId}`, null, null]
        : item.type === 'saved_query'
          ? [`query ${item.queryId}`, 'result SHA-256', item.resultSha256]
          : [`${item.file} in bundle ${item.bundleId}`, 'SHA-256', item.sha256];
  return (
    <div className="min-w-0 text-sm">
      <p>
        <span className="font-bold">{EVIDENCE_TYPE_LABELS[item.type]}</span>{' '}
        <span className="text-ink-muted break-all">{reference}</span>
      </p>
      {hash && (
        <p className="text-xs text-ink-muted">
          {hashLabel} <code className="break-all">{hash}</code>
        </p>
      )}
    </div>
  );
}

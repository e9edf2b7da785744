/**
 * Cited evidence by name: a finding stores ids and hashes (what makes a citation verifiable);
 * people read the bookmark's note and time, the replay's label, the query's title and the file's
 * name. The same wording is used by the workspace and by the archive's report.html.
 */
import type { TEvidenceItem } from './contracts/findings';
import { CAUSE_KIND_LABELS } from './human-labels';

export const EVIDENCE_TYPE_LABELS: Record<TEvidenceItem['type'], string> = {
  replay: 'Replay',
  bookmark: 'Bookmark',
  saved_query: 'Saved query',
  cause: 'Probable cause',
  bundle_file: 'Bundle file',
  figure: 'Figure',
};

export interface EvidenceNames {
  replays: ReadonlyMap<string, { label: string; bundleId: string }>;
  bookmarks: ReadonlyMap<
    string,
    { note: string; t: number; replayId: string; replayLabel: string; bundleId: string }
  >;
  queries: ReadonlyMap<string, { title: string; bundleId: string }>;
  bundles: ReadonlyMap<string, { originalName: string }>;
  figures: ReadonlyMap<string, { caption: string; fileName: string; sha256: string }>;
}

/** Where a cited item can be opened: a bundle's workspace, at a replay and moment when known. */
export interface EvidenceTarget {
  bundleId: string;
  replayId?: string;
  t?: number;
  /** A saved query opens in its bundle's SQL console. */
  isQuery?: boolean;
}

export interface NamedEvidence {
  /** What a person calls it: the bookmark's note, the replay's label, the file's name. */
  name: string;
  /** The identifying detail beside the name: moment, short digest or hash, bundle. */
  detail: string;
  /** The full hash the citation stores, for checking, with what it is. */
  hash: { label: string; value: string } | null;
  /** False when the cited item is not (or no longer) in this case: only its id is known. */
  isFound: boolean;
  target: EvidenceTarget | null;
  /** A cited figure's picture, so it can be shown as a thumbnail or linked. */
  picture?: { figureId: string; fileName: string };
}

export const EMPTY_EVIDENCE_NAMES: EvidenceNames = {
  replays: new Map(),
  bookmarks: new Map(),
  queries: new Map(),
  bundles: new Map(),
  figures: new Map(),
};

/** The first 12 hex digits of a hash: enough to tell items apart on screen; the full one is kept. */
export const shortHash = (hash: string) => (hash.length > 12 ? `${hash.slice(0, 12)}…` : hash);
const shortId = (id: string) => id.slice(0, 8);
const seconds = (t: number) => `${t.toFixed(1)} s`;

function bundleName(names: EvidenceNames, bundleId: string): string {
  return names.bundles.get(bundleId)?.originalName ?? `bundle ${shortId(bundleId)}`;
}

export function nameEvidence(item: TEvidenceItem, names: EvidenceNames): NamedEvidence {
  switch (item.type) {
    case 'replay': {
      const replay = names.replays.get(item.replayId);
      const hash = { label: 'digest', value: item.digest };
      if (!replay)
        return missing(`Replay ${shortId(item.replayId)}`, `digest ${shortHash(item.digest)}`, hash);
      return {
        name: replay.label.trim() || `Replay ${shortId(item.replayId)}`,
        detail: `replay of ${bundleName(names, replay.bundleId)}, digest ${shortHash(item.digest)}`,
        hash,
        isFound: true,
        target: { bundleId: replay.bundleId, replayId: item.replayId },
      };
    }
    case 'cause': {
      const replay = names.replays.get(item.replayId);
      const hash = { label: 'replay digest', value: item.digest };
      const name = CAUSE_KIND_LABELS[item.kind];
      if (!replay) return missing(name, `in replay ${shortId(item.replayId)}`, hash);
      return {
        name,
        detail: `probable cause in replay ${replay.label.trim() || shortId(item.replayId)}, digest ${shortHash(item.digest)}`,
        hash,
        isFound: true,
        target: { bundleId: replay.bundleId, replayId: item.replayId },
      };
    }
    case 'bookmark': {
      const bookmark = names.bookmarks.get(item.bookmarkId);
      if (!bookmark) return missing(`Bookmark ${shortId(item.bookmarkId)}`, '', null);
      return {
        name: bookmark.note.trim() || `Moment at ${seconds(bookmark.t)}`,
        detail: `at ${seconds(bookmark.t)} in replay ${bookmark.replayLabel}`,
        hash: null,
        isFound: true,
        target: { bundleId: bookmark.bundleId, replayId: bookmark.replayId, t: bookmark.t },
      };
    }
    case 'saved_query': {
      const query = names.queries.get(item.queryId);
      const hash = { label: 'result SHA-256', value: item.resultSha256 };
      if (!query)
        return missing(
          `Saved query ${shortId(item.queryId)}`,
          `result ${shortHash(item.resultSha256)}`,
          hash,
        );
      return {
        name: query.title,
        detail: `query on ${bundleName(names, query.bundleId)}, result ${shortHash(item.resultSha256)}`,
        hash,
        isFound: true,
        target: { bundleId: query.bundleId, isQuery: true },
      };
    }
    case 'bundle_file': {
      const isFound = names.bundles.has(item.bundleId);
      return {
        name: item.file,
        detail: `in ${bundleName(names, item.bundleId)}, SHA-256 ${shortHash(item.sha256)}`,
        hash: { label: 'SHA-256', value: item.sha256 },
        isFound,
        target: isFound ? { bundleId: item.bundleId } : null,
      };
    }
    case 'figure': {
      const figure = names.figures.get(item.figureId);
      const hash = { label: 'SHA-256', value: item.sha256 };
      if (!figure)
        return missing(`Figure ${shortId(item.figureId)}`, `SHA-256 ${shortHash(item.sha256)}`, hash);
      return {
        name: figure.caption,
        detail: `picture ${figure.fileName}, SHA-256 ${shortHash(item.sha256)}`,
        hash,
        isFound: true,
        target: null,
        picture: { figureId: item.figureId, fileName: figure.fileName },
      };
    }
  }
}

function missing(name: string, detail: string, hash: NamedEvidence['hash']): NamedEvidence {
  return {
    name,
    detail: [detail, 'not found in this case'].filter(Boolean).join(', '),
    hash,
    isFound: false,
    target: null,
  };
}

/** The lookup maps from the list form the API sends. */
export function toEvidenceNames(lists: {
  replays: readonly { id: string; label: string; bundleId: string }[];
  bookmarks: readonly {
    id: string;
    note: string;
    t: number;
    replayId: string;
    replayLabel: string;
    bundleId: string;
  }[];
  queries: readonly { id: string; title: string; bundleId: string }[];
  bundles: readonly { id: string; originalName: string }[];
  figures: readonly { id: string; caption: string; fileName: string; sha256: string }[];
}): EvidenceNames {
  const byId = <T extends { id: string }>(items: readonly T[]) =>
    new Map(items.map((item) => [item.id, item]));
  return {
    replays: byId(lists.replays),
    bookmarks: byId(lists.bookmarks),
    queries: byId(lists.queries),
    bundles: byId(lists.bundles),
    figures: byId(lists.figures),
  };
}

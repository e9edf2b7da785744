import type { TFigure } from '../../../../shared/contracts/figures';
import type { FigureRow } from '../../db/schema';
import type { Person } from '../findings/people';

/** A figure row as the API answers it, with who saved it by name. */
export function toFigure(row: FigureRow, people: ReadonlyMap<string, Person>): TFigure {
  return {
    id: row.id,
    caseId: row.caseId,
    sha256: row.sha256,
    sizeBytes: row.sizeBytes,
    mediaType: row.mediaType,
    fileName: row.fileName,
    caption: row.caption,
    replayId: row.replayId,
    step: row.step,
    uploadedBy: { id: row.uploadedBy, name: people.get(row.uploadedBy)?.name ?? 'unknown' },
    uploadedAt: row.uploadedAt.toISOString(),
  };
}

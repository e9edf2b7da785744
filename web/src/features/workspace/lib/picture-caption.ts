import { shortHash } from '@shared/evidence-names';

export type PictureSubject = 'map' | 'timeline';
export type PictureFormat = 'svg' | 'png';

/** The moment a picture shows, read from what is actually drawn, not from the slider. */
export interface PictureMoment {
  replayId: string;
  replayLabel: string;
  /** null while a replay has no digest yet; the caption then says so. */
  digest: string | null;
  step: number;
  /** s since start_time */
  time: number;
}

const SUBJECT_WORDS: Record<PictureSubject, string> = { map: 'Map', timeline: 'Timeline' };

/**
 * The line printed on every exported picture: which replay (label and short digest) and which
 * step and time, so a picture lifted into a report can never be mistaken for another moment.
 */
export function pictureCaption(subject: PictureSubject, moment: PictureMoment): string {
  const replay = moment.replayLabel.trim() || `replay ${moment.replayId.slice(0, 8)}`;
  const digest = moment.digest ? `digest ${shortHash(moment.digest)}` : 'no digest yet';
  return `${SUBJECT_WORDS[subject]} · ${replay} · ${digest} · step ${moment.step} · ${moment.time.toFixed(2)} s`;
}

/** `map-3f2a9c1e-step-42.png`: the file says what and when before anyone opens it. */
export function pictureFileName(subject: PictureSubject, moment: PictureMoment, format: PictureFormat) {
  return `${subject}-${moment.replayId.slice(0, 8)}-step-${moment.step}.${format}`;
}

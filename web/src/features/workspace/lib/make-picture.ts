import { type MapScale, mapPictureSvg } from './map-picture';
import {
  type PictureFormat,
  type PictureMoment,
  type PictureSubject,
  pictureCaption,
  pictureFileName,
} from './picture-caption';
import { rasteriseSvg } from './rasterise-svg';
import { timelinePictureSvg } from './timeline-picture';

export interface Picture {
  blob: Blob;
  fileName: string;
  caption: string;
  moment: PictureMoment;
}

export interface PictureSource {
  /** Holds the workspace's map canvas and timeline SVG. */
  container: HTMLElement;
  replay: { id: string; label: string; digest: string | null };
  /** The replay's step times, s since start_time. */
  times: readonly number[];
}

/** The step each view has actually drawn (its own data attribute), so the caption matches the pixels. */
function drawnStep(subject: PictureSubject, element: Element): number {
  const attribute = subject === 'map' ? 'drawnStep' : 'cursorStep';
  const step = Number((element as HTMLElement | SVGElement).dataset[attribute]);
  if (!Number.isInteger(step) || step < 0) {
    throw new Error(`The ${subject} has not drawn a step yet; wait until it shows one and try again.`);
  }
  return step;
}

/** The scale bar the map shows now, from its data attributes; null before the map is laid out. */
function mapScale(container: HTMLElement): MapScale | null {
  const bar = container.querySelector<HTMLElement>('[data-testid="scale-bar"]');
  const px = Number(bar?.dataset.px);
  const metres = Number(bar?.dataset.metres);
  return Number.isFinite(px) && Number.isFinite(metres) && px > 0 ? { px, metres } : null;
}

/** Makes the picture of the map or the timeline as it is on screen now, as SVG or PNG. */
export async function makePicture(
  source: PictureSource,
  subject: PictureSubject,
  format: PictureFormat,
): Promise<Picture> {
  const selector = subject === 'map' ? 'canvas[data-testid="map-canvas"]' : 'svg[data-testid="timeline"]';
  const element = source.container.querySelector(selector);
  if (!element) throw new Error(`The ${subject} is not on screen.`);
  const step = drawnStep(subject, element);
  const moment: PictureMoment = {
    replayId: source.replay.id,
    replayLabel: source.replay.label,
    digest: source.replay.digest,
    step,
    time: source.times[step] ?? 0,
  };
  const caption = pictureCaption(subject, moment);
  const svgText =
    subject === 'map'
      ? mapPictureSvg(element as HTMLCanvasElement, caption, mapScale(source.container))
      : timelinePictureSvg(element as SVGSVGElement, caption);
  const blob =
    format === 'svg' ? new Blob([svgText], { type: 'image/svg+xml' }) : await rasteriseSvg(svgText);
  return { blob, fileName: pictureFileName(subject, moment, format), caption, moment };
}

/**
 * What a person set up on the map, as kept with a bookmark: centre (m, map frame), zoom (px per m),
 * follow-robot and the optional layers shown. Same shape as the bookmark contract's `view`.
 */
export interface MapViewState {
  centerX: number;
  centerY: number;
  zoom: number;
  followRobot?: boolean;
  layers?: string[];
}

export const HEATMAP_LAYER = 'heatmap';
/** The map-disagreement heat map of the step on screen only. */
export const HEATMAP_MOMENT_LAYER = 'heatmap-moment';

/** Which map disagreement the map shades: none, the step on screen, or the whole replay. */
export type HeatMode = 'off' | 'moment' | 'replay';

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

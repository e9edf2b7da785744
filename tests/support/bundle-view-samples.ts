/** Role-matrix samples for the workspace's read-only bundle views (map, tracks, clearance). */
export function bundleViewSamples(): Record<
  string,
  (f: { bundleId: string; replayId: string }) => { path: string }
> {
  return {
    'get /bundles/:id/map': (f) => ({ path: `/api/bundles/${f.bundleId}/map` }),
    'get /bundles/:id/tracks': (f) => ({ path: `/api/bundles/${f.bundleId}/tracks` }),
    'get /bundles/:id/replays/:replayId/clearance': (f) => ({
      path: `/api/bundles/${f.bundleId}/replays/${f.replayId}/clearance`,
    }),
  };
}

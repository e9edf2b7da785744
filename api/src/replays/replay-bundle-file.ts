import type { Bundle } from '../../../shared/bundle/types';
import type { ReplaySettings, TReplayOverrides } from '../../../shared/engine/settings';
import { resolveReplaySettings } from '../../../shared/engine/settings';
import { inspectBundle } from '../bundles/inspect-bundle';

export class ReplayInputError extends Error {}

/** Reads and validates a stored bundle zip for replaying; throws `ReplayInputError` with the reasons. */
export async function loadBundleForReplay(zipPath: string, maxUnpackedBytes?: number): Promise<Bundle> {
  const inspection = await inspectBundle(
    { kind: 'zip', path: zipPath },
    maxUnpackedBytes ? { maxTotalBytes: maxUnpackedBytes } : {},
  );
  if (!inspection.ok || !inspection.bundle) {
    const first = inspection.issues.find((issue) => issue.severity !== 'warning');
    throw new ReplayInputError(
      `The bundle is not valid: ${first ? `${first.file}: ${first.message}` : 'unreadable'}`,
    );
  }
  return inspection.bundle;
}

/** Manifest filter block + overrides, or a `ReplayInputError` naming the fields at fault. */
export function settingsFor(bundle: Bundle, overrides: TReplayOverrides): ReplaySettings {
  const resolved = resolveReplaySettings(bundle.manifest, overrides);
  if (!resolved.ok) {
    throw new ReplayInputError(resolved.issues.map((issue) => `${issue.field}: ${issue.message}`).join('; '));
  }
  return resolved.settings;
}

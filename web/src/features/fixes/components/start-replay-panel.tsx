import type { TReplay } from '@shared/contracts/replays';
import { useQueryClient } from '@tanstack/react-query';
import { type CaseReplays, caseReplaysQueryOptions } from '@web/components/case-replays-query';
import { FormField } from '@web/components/form-field';
import { SelectInput } from '@web/components/inputs';
import type { ReactNode } from 'react';
import { useState } from 'react';

/** The replay settings form for a bundle, handed in by the page (it belongs to the replays feature). */
export type RenderReplayLauncher = (bundleId: string, onStarted: (replay: TReplay) => void) => ReactNode;

/** Starts a replay of a bundle under the fixed settings and hands its id to the fix form. */
export function StartReplayPanel({
  caseId,
  replays,
  renderReplayLauncher,
  onStarted,
}: {
  caseId: string;
  replays?: CaseReplays;
  renderReplayLauncher: RenderReplayLauncher;
  onStarted: (replayId: string) => void;
}) {
  const bundles = (replays?.bundles ?? []).filter((b) => b.status === 'valid');
  const [bundleId, setBundleId] = useState('');
  const chosen = bundleId || bundles[0]?.id || '';
  const queryClient = useQueryClient();
  // The launcher refreshes its bundle's list; the fix form picks from the case's, so refresh that too.
  const onReplayStarted = (replay: TReplay) => {
    void queryClient.invalidateQueries({ queryKey: caseReplaysQueryOptions(caseId).queryKey });
    onStarted(replay.id);
  };

  return (
    <section
      aria-label="Start a verification replay"
      className="space-y-3 rounded-md border border-dashed border-canvas-line p-3"
    >
      <p className="text-sm font-bold">Start a verification replay</p>
      <FormField label="Bundle to replay">
        {(control) => (
          <SelectInput {...control} value={chosen} onChange={(e) => setBundleId(e.target.value)}>
            {bundles.length === 0 && <option value="">No valid bundle on this case</option>}
            {bundles.map((b) => (
              <option key={b.id} value={b.id}>
                {b.originalName}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      {chosen && renderReplayLauncher(chosen, onReplayStarted)}
    </section>
  );
}

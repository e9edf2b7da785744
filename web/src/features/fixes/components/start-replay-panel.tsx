import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import type { CaseReplays } from '@web/components/case-replays-query';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextArea, TextInput } from '@web/components/inputs';
import { Play } from 'lucide-react';
import { useState } from 'react';
import { useStartVerificationReplay } from '../api/start-verification-replay';
import { parseOverrides } from '../lib/parse-overrides';

/** Starts a replay of a bundle under the fixed settings and hands its id to the fix form. */
export function StartReplayPanel({
  caseId,
  replays,
  onStarted,
}: {
  caseId: string;
  replays?: CaseReplays;
  onStarted: (replayId: string) => void;
}) {
  const start = useStartVerificationReplay(caseId);
  const bundles = (replays?.bundles ?? []).filter((b) => b.status === 'valid');
  const [bundleId, setBundleId] = useState('');
  const [label, setLabel] = useState('Verification');
  const [overridesText, setOverridesText] = useState('');
  const [problem, setProblem] = useState<string>();
  const chosen = bundleId || bundles[0]?.id || '';

  function run() {
    const { overrides, problem: overridesProblem } = parseOverrides(overridesText);
    setProblem(overridesProblem);
    if (!overrides || !chosen) return;
    start.mutate(
      { bundleId: chosen, body: { label: label.trim() || undefined, overrides } },
      { onSuccess: (replay) => onStarted(replay.id) },
    );
  }

  return (
    <div className="space-y-3 rounded-md border border-dashed border-canvas-line p-3">
      <p className="text-sm font-bold">Start a verification replay</p>
      <div className="grid grid-cols-2 gap-3">
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
        <FormField label="Replay label" isOptional>
          {(control) => <TextInput {...control} value={label} onChange={(e) => setLabel(e.target.value)} />}
        </FormField>
      </div>
      <FormField
        label="Fixed settings (replay overrides)"
        isOptional
        hint='JSON, e.g. {"particles": 2000, "recovery": true}; empty replays with the manifest settings.'
        error={problem}
      >
        {(control) => (
          <TextArea
            {...control}
            className="min-h-16 font-mono"
            value={overridesText}
            onChange={(e) => setOverridesText(e.target.value)}
          />
        )}
      </FormField>
      {start.isError && <Alert>{start.error.message}</Alert>}
      <Button size="sm" icon={Play} onClick={run} isBusy={start.isPending} disabled={!chosen}>
        Start replay
      </Button>
    </div>
  );
}

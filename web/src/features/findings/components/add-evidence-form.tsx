import { type TEvidenceItem, ZEvidenceItem } from '@shared/contracts/findings';
import { EVIDENCE_TYPE_LABELS } from '@shared/evidence-names';
import { CAUSE_KIND_LABELS, labelFor } from '@shared/human-labels';
import { useQuery } from '@tanstack/react-query';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { caseReplaysQueryOptions, describeReplay } from '@web/components/case-replays-query';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextInput } from '@web/components/inputs';
import { useReplayCauses } from '@web/components/replay-causes-query';
import { Plus } from 'lucide-react';
import { useState } from 'react';
import { useEvidenceNames } from '../api/get-evidence-names';
import { type EvidenceSource, sourceLabel, useEvidenceSources } from '../api/get-evidence-sources';
import { FigurePicker } from './figure-picker';

interface Pending {
  type: TEvidenceItem['type'];
  id: string;
  /** The cited probable cause's kind, when citing a cause. */
  kind: string;
  bundleId: string;
  file: string;
  resultSha256: string;
}
const EMPTY: Pending = { type: 'replay', id: '', kind: '', bundleId: '', file: '', resultSha256: '' };

function SourcePicker({
  label,
  sources,
  value,
  onChange,
}: {
  label: string;
  sources: EvidenceSource[] | null | undefined;
  value: string;
  onChange: (id: string) => void;
}) {
  if (sources === null || sources === undefined)
    return (
      <FormField
        label={`${label} id`}
        hint={`This server does not list ${label.toLowerCase()}s yet; paste the id.`}
      >
        {(control) => (
          <TextInput {...control} value={value} onChange={(e) => onChange(e.target.value.trim())} />
        )}
      </FormField>
    );
  return (
    <FormField label={label}>
      {(control) => (
        <SelectInput {...control} value={value} onChange={(e) => onChange(e.target.value)}>
          <option value="">Choose…</option>
          {sources.map((s) => (
            <option key={s.id} value={s.id}>
              {sourceLabel(s)}
            </option>
          ))}
        </SelectInput>
      )}
    </FormField>
  );
}

/** Builds one complete citation, so the draft never holds a half-chosen item the server would refuse. */
export function AddEvidenceForm({ caseId, onAdd }: { caseId: string; onAdd: (item: TEvidenceItem) => void }) {
  const replays = useQuery(caseReplaysQueryOptions(caseId));
  const sources = useEvidenceSources(caseId);
  const [pending, setPending] = useState<Pending>(EMPTY);
  const [problem, setProblem] = useState<string>();
  const set = (patch: Partial<Pending>) => setPending((p) => ({ ...p, ...patch }));

  const bundles = replays.data?.bundles ?? [];
  const doneReplays = (replays.data?.replays ?? []).filter((r) => r.status === 'done' && r.digest);
  const replay = doneReplays.find((r) => r.id === pending.id);
  const replayOptions = (
    <>
      <option value="">{replays.isPending ? 'Loading replays…' : 'Choose a replay…'}</option>
      {doneReplays.map((r) => (
        <option key={r.id} value={r.id}>
          {describeReplay(r, bundles)}
        </option>
      ))}
    </>
  );
  const bundle = bundles.find((b) => b.id === pending.bundleId);
  const file = bundle?.files.find((f) => f.name === pending.file);
  const query = sources.data?.queries?.find((q) => q.id === pending.id);
  const causes = useReplayCauses(pending.type === 'cause' ? pending.id : '');
  const figures = useEvidenceNames(caseId).data?.figures;

  function build(): unknown {
    switch (pending.type) {
      case 'replay':
        return { type: 'replay', replayId: pending.id, digest: replay?.digest ?? '' };
      case 'cause':
        return { type: 'cause', replayId: pending.id, digest: replay?.digest ?? '', kind: pending.kind };
      case 'bookmark':
        return { type: 'bookmark', bookmarkId: pending.id };
      case 'saved_query':
        return {
          type: 'saved_query',
          queryId: pending.id,
          resultSha256: query?.resultSha256 ?? pending.resultSha256,
        };
      case 'bundle_file':
        return {
          type: 'bundle_file',
          bundleId: pending.bundleId,
          file: pending.file,
          sha256: file?.sha256 ?? '',
        };
      case 'figure':
        return { type: 'figure', figureId: pending.id, sha256: figures?.get(pending.id)?.sha256 ?? '' };
    }
  }

  function add() {
    const parsed = ZEvidenceItem.safeParse(build());
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      setProblem(
        `Choose the ${EVIDENCE_TYPE_LABELS[pending.type].toLowerCase()} to cite (${issue?.path.join('.')}: ${issue?.message}).`,
      );
      return;
    }
    setProblem(undefined);
    onAdd(parsed.data);
    setPending({ ...EMPTY, type: pending.type });
  }

  return (
    <div className="rounded-md border border-dashed border-canvas-line p-3">
      <div className="grid grid-cols-[12rem_minmax(0,1fr)] items-start gap-3">
        <FormField label="Cite a">
          {(control) => (
            <SelectInput
              {...control}
              value={pending.type}
              onChange={(e) => setPending({ ...EMPTY, type: e.target.value as Pending['type'] })}
            >
              {Object.entries(EVIDENCE_TYPE_LABELS).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
        <div className="space-y-2">
          {pending.type === 'cause' && (
            <div className="grid grid-cols-2 gap-3">
              <FormField label="Replay of the cause" hint="Finished replays of this case’s bundles.">
                {(control) => (
                  <SelectInput
                    {...control}
                    value={pending.id}
                    onChange={(e) => set({ id: e.target.value, kind: '' })}
                  >
                    {replayOptions}
                  </SelectInput>
                )}
              </FormField>
              <FormField
                label="Cause"
                hint={
                  causes.isError
                    ? `Could not load the replay’s causes: ${causes.error.message}`
                    : causes.data?.length === 0
                      ? 'This replay has no probable causes.'
                      : undefined
                }
              >
                {(control) => (
                  <SelectInput
                    {...control}
                    value={pending.kind}
                    disabled={!pending.id || !causes.data?.length}
                    onChange={(e) => set({ kind: e.target.value })}
                  >
                    <option value="">{causes.isFetching ? 'Loading causes…' : 'Choose a cause…'}</option>
                    {causes.data?.map((cause) => (
                      <option key={`${cause.kind}-${cause.start}`} value={cause.kind}>
                        {labelFor(CAUSE_KIND_LABELS, cause.kind)}, confidence {cause.confidence.toFixed(2)}
                      </option>
                    ))}
                  </SelectInput>
                )}
              </FormField>
            </div>
          )}
          {pending.type === 'replay' && (
            <FormField
              label="Replay"
              hint={replay ? `Digest ${replay.digest}` : 'Finished replays of this case’s bundles.'}
            >
              {(control) => (
                <SelectInput {...control} value={pending.id} onChange={(e) => set({ id: e.target.value })}>
                  {replayOptions}
                </SelectInput>
              )}
            </FormField>
          )}
          {pending.type === 'bookmark' && (
            <SourcePicker
              label="Bookmark"
              sources={sources.data?.bookmarks}
              value={pending.id}
              onChange={(id) => set({ id })}
            />
          )}
          {pending.type === 'saved_query' && (
            <>
              <SourcePicker
                label="Saved query"
                sources={sources.data?.queries}
                value={pending.id}
                onChange={(id) => set({ id })}
              />
              {!query?.resultSha256 && (
                <FormField label="Result SHA-256" hint="64 hex digits, as the saved query reports it.">
                  {(control) => (
                    <TextInput
                      {...control}
                      value={pending.resultSha256}
                      onChange={(e) => set({ resultSha256: e.target.value.trim().toLowerCase() })}
                    />
                  )}
                </FormField>
              )}
            </>
          )}
          {pending.type === 'figure' && (
            <FigurePicker figures={figures} value={pending.id} onChange={(id) => set({ id })} />
          )}
          {pending.type === 'bundle_file' && (
            <div className="grid grid-cols-2 gap-3">
              <FormField label="Bundle">
                {(control) => (
                  <SelectInput
                    {...control}
                    value={pending.bundleId}
                    onChange={(e) => set({ bundleId: e.target.value, file: '' })}
                  >
                    <option value="">Choose a bundle…</option>
                    {bundles.map((b) => (
                      <option key={b.id} value={b.id}>
                        {b.originalName}
                      </option>
                    ))}
                  </SelectInput>
                )}
              </FormField>
              <FormField label="File" hint={file ? `SHA-256 ${file.sha256}` : undefined}>
                {(control) => (
                  <SelectInput
                    {...control}
                    value={pending.file}
                    disabled={!bundle}
                    onChange={(e) => set({ file: e.target.value })}
                  >
                    <option value="">Choose a file…</option>
                    {bundle?.files.map((f) => (
                      <option key={f.name} value={f.name}>
                        {f.name}
                      </option>
                    ))}
                  </SelectInput>
                )}
              </FormField>
            </div>
          )}
        </div>
      </div>
      {replays.isError && (
        <Alert className="mt-2">Could not load the case’s replays: {replays.error.message}</Alert>
      )}
      {problem && <Alert className="mt-2">{problem}</Alert>}
      <Button size="sm" className="mt-2" icon={Plus} onClick={add}>
        Add evidence
      </Button>
    </div>
  );
}

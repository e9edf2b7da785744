import { FormField } from '@web/components/form-field';
import { SelectInput } from '@web/components/inputs';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { Equal } from 'lucide-react';
import { useFindingsDiff } from '../api/get-findings-diff';
import { useFindingsVersions } from '../api/get-findings-versions';
import { formatDiffPath, formatDiffValue } from '../lib/format-diff-value';

interface DiffProps {
  caseId: string;
  from: number;
  to: number;
  onChange: (from: number, to: number) => void;
}

function VersionSelect({
  label,
  value,
  versions,
  onChange,
}: {
  label: string;
  value: number;
  versions: number[];
  onChange: (v: number) => void;
}) {
  return (
    <FormField label={label} className="w-40">
      {(control) => (
        <SelectInput {...control} value={value} onChange={(e) => onChange(Number(e.target.value))}>
          {versions.map((v) => (
            <option key={v} value={v}>
              Version {v}
            </option>
          ))}
        </SelectInput>
      )}
    </FormField>
  );
}

/** What changed between two versions, leaf by leaf, old value beside new. */
export function FindingsDiffView({ caseId, from, to, onChange }: DiffProps) {
  const versions = useFindingsVersions(caseId);
  const numbers = (versions.data?.items ?? []).map((v) => v.version).sort((a, b) => a - b);
  const isReady = from >= 1 && to >= 1 && from !== to;
  const diff = useFindingsDiff(caseId, from, to, isReady);

  return (
    <div className="space-y-4">
      <div className="flex items-end gap-3">
        <VersionSelect label="From" value={from} versions={numbers} onChange={(v) => onChange(v, to)} />
        <VersionSelect label="To" value={to} versions={numbers} onChange={(v) => onChange(from, v)} />
      </div>
      {!isReady ? (
        <EmptyState icon={Equal} title="Pick two different versions">
          Comparison needs at least two submitted versions.
        </EmptyState>
      ) : diff.isError ? (
        <ErrorState
          error={diff.error}
          title="Could not compare these versions"
          onRetry={() => diff.refetch()}
        />
      ) : !diff.data ? (
        <SkeletonBar className="w-64" />
      ) : diff.data.changes.length === 0 ? (
        <EmptyState icon={Equal} title="No differences" />
      ) : (
        <table className="w-full table-fixed text-sm">
          <caption className="sr-only">
            Changes from version {from} to version {to}
          </caption>
          <thead className="text-left text-xs text-ink-muted uppercase">
            <tr>
              <th className="w-56 py-1">Where</th>
              <th>Version {from}</th>
              <th>Version {to}</th>
            </tr>
          </thead>
          <tbody>
            {diff.data.changes.map((change) => (
              <tr key={change.path} className="border-t border-canvas-line align-top">
                <td className="py-2 pr-3 font-bold">{formatDiffPath(change.path)}</td>
                <td className="py-2 pr-3">
                  <del className="block whitespace-pre-wrap break-words bg-state-bad/5 text-ink no-underline">
                    <span className="sr-only">Before: </span>
                    {formatDiffValue(change.before)}
                  </del>
                </td>
                <td className="py-2">
                  <ins className="block whitespace-pre-wrap break-words bg-state-ok/10 text-ink no-underline">
                    <span className="sr-only">After: </span>
                    {formatDiffValue(change.after)}
                  </ins>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}

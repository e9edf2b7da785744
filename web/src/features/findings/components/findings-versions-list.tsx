import type { TFindingsVersionSummary } from '@shared/contracts/findings';
import { REVIEW_WORDS } from '@shared/review-words';
import { LocalTime } from '@web/components/local-time';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { Archive, BadgeCheck, Clock, FileStack, type LucideIcon, MessageSquareWarning } from 'lucide-react';
import { Link } from 'react-router-dom';
import { useFindingsVersions } from '../api/get-findings-versions';

const STATE: Record<
  TFindingsVersionSummary['state'],
  { icon: LucideIcon; label: string; className: string }
> = {
  submitted: { icon: Clock, label: 'Awaiting review', className: 'text-state-warn' },
  returned: { icon: MessageSquareWarning, label: REVIEW_WORDS.returnedStatus, className: 'text-state-bad' },
  signed: { icon: BadgeCheck, label: 'Signed', className: 'text-state-ok' },
  superseded: { icon: Archive, label: 'Superseded', className: 'text-ink-muted' },
};

export function VersionStateLabel({ state }: { state: TFindingsVersionSummary['state'] }) {
  const { icon: Icon, label, className } = STATE[state];
  return (
    <span className={`inline-flex items-center gap-1 text-sm font-bold ${className}`}>
      <Icon aria-hidden className="size-4" />
      {label}
    </span>
  );
}

/** Every frozen version, newest first, with links to read, review and compare them. */
export function FindingsVersionsList({ caseId }: { caseId: string }) {
  const versions = useFindingsVersions(caseId);
  if (versions.isError)
    return (
      <ErrorState
        error={versions.error}
        title="Could not load the versions"
        onRetry={() => versions.refetch()}
      />
    );
  if (!versions.data) return <SkeletonBar className="w-48" />;
  const items = [...versions.data.items].sort((a, b) => b.version - a.version);
  if (items.length === 0)
    return (
      <EmptyState icon={FileStack} title="No version submitted yet">
        Submitting the findings freezes version 1.
      </EmptyState>
    );
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Findings versions</caption>
      <thead className="text-left text-xs text-ink-muted uppercase">
        <tr>
          <th className="py-1">Version</th>
          <th>State</th>
          <th>Author</th>
          <th>Submitted</th>
          <th>
            <span className="sr-only">Compare</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {items.map((item) => (
          <tr key={item.version} className="border-t border-canvas-line">
            <td className="py-2">
              <Link
                className="font-bold text-accent hover:underline"
                to={paths.caseFindingsVersion.href(caseId, item.version)}
              >
                Version {item.version}
              </Link>
            </td>
            <td>
              <VersionStateLabel state={item.state} />
            </td>
            <td>{item.author.name}</td>
            <td>
              <LocalTime iso={item.submittedAt} />
            </td>
            <td className="text-right">
              {item.version > 1 && (
                <Link
                  className="text-accent hover:underline"
                  to={paths.caseFindingsDiff.href(caseId, item.version - 1, item.version)}
                >
                  Changes from {item.version - 1}
                </Link>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

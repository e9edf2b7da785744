import { LocalTime } from '@web/components/local-time';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { FileArchive, Microscope, Upload } from 'lucide-react';
import { Link } from 'react-router-dom';
import { useCaseBundles } from '../api/get-case-bundles';
import { BundleStatusBadge } from './bundle-status-badge';

/** The case's bundles with status, hash and uploader; valid ones link into the workspace. */
export function CaseBundlesList({ caseId, canUpload }: { caseId: string; canUpload: boolean }) {
  const bundles = useCaseBundles(caseId);
  const uploadLink = canUpload && (
    <Link
      to={paths.uploadBundle.href(caseId)}
      className="inline-flex items-center gap-1.5 rounded-md bg-accent px-3 py-1.5 text-sm font-bold text-white"
    >
      <Upload aria-hidden className="size-4" /> Upload bundle
    </Link>
  );
  if (bundles.isError)
    return (
      <ErrorState
        error={bundles.error}
        title="Could not load the bundles"
        onRetry={() => bundles.refetch()}
      />
    );
  if (!bundles.data) {
    return (
      <div aria-busy className="space-y-2 py-3">
        <SkeletonBar className="w-full" />
        <SkeletonBar className="w-2/3" />
      </div>
    );
  }
  if (bundles.data.items.length === 0) {
    return (
      <EmptyState icon={FileArchive} title="No log bundles attached" action={uploadLink}>
        A bundle is the robot's recorded logs around the incident. Once one is attached, its replays, flags
        and findings are listed here.
      </EmptyState>
    );
  }
  return (
    <div>
      <ul className="mt-2 divide-y divide-canvas-line" aria-label="Bundles of this case">
        {bundles.data.items.map((bundle) => (
          <li
            key={bundle.id}
            className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2"
            data-testid="bundle-row"
          >
            <BundleStatusBadge status={bundle.status} />
            <span className="font-bold">{bundle.originalName}</span>
            <span className="font-mono text-xs text-ink-muted" title={bundle.sha256}>
              SHA-256 {bundle.sha256.slice(0, 12)}…
            </span>
            <span className="text-xs text-ink-muted">
              {bundle.uploadedBy.name}, <LocalTime iso={bundle.uploadedAt} />
            </span>
            {bundle.status === 'valid' ? (
              <Link
                to={paths.workspace.href(bundle.id)}
                className="ml-auto inline-flex items-center gap-1 text-sm font-bold text-accent hover:underline"
              >
                <Microscope aria-hidden className="size-4" /> Open workspace
              </Link>
            ) : (
              <span className="ml-auto text-xs text-state-bad">
                {bundle.issues.filter((i) => i.severity !== 'warning').length} problem(s)
              </span>
            )}
          </li>
        ))}
      </ul>
      {uploadLink && <div className="mt-3">{uploadLink}</div>}
    </div>
  );
}

import { PageHeader } from '@web/components/page-header';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { useBundle } from '@web/features/bundles/api/get-bundle';
import { SqlConsolePanel } from '@web/features/sql-console/components/sql-console-panel';
import { Link, useParams } from 'react-router-dom';

/** The SQL console on a page of its own, for one bundle of a case. */
export function BundleSqlConsoleRoute() {
  const { caseId = '', bundleId = '' } = useParams();
  const bundle = useBundle(bundleId);
  if (bundle.isPending) return <SkeletonBar className="w-64" />;
  if (bundle.isError)
    return <ErrorState error={bundle.error} title="Could not load the bundle" onRetry={bundle.refetch} />;
  return (
    <div className="mx-auto max-w-6xl">
      <PageHeader
        eyebrow={
          <Link className="underline" to={paths.caseDetail.href(caseId)}>
            Back to the case
          </Link>
        }
        title={`SQL console · ${bundle.data.originalName}`}
        description="Query the bundle's logs in your browser. Saved queries keep the SHA-256 of their result."
      />
      <SqlConsolePanel
        caseId={caseId}
        bundleId={bundleId}
        tables={bundle.data.tables.map((table) => table.name)}
      />
    </div>
  );
}

import type { TBundleIssue } from '@shared/contracts/bundles';
import { CircleAlert, TriangleAlert } from 'lucide-react';

/** Issues grouped by file, each with its line, field, expected and found values. */
export function ValidationReport({ issues }: { issues: TBundleIssue[] }) {
  const byFile = new Map<string, TBundleIssue[]>();
  for (const issue of issues) byFile.set(issue.file, [...(byFile.get(issue.file) ?? []), issue]);
  return (
    <div className="space-y-4" data-testid="validation-report">
      {[...byFile.entries()].map(([file, fileIssues]) => (
        <section key={file} aria-label={`Problems in ${file}`}>
          <h3 className="font-mono text-sm font-bold">
            {file}{' '}
            <span className="font-sans font-normal text-ink-muted">
              ({fileIssues.length} problem{fileIssues.length === 1 ? '' : 's'})
            </span>
          </h3>
          <table className="mt-1 w-full text-left text-sm">
            <thead className="text-xs text-ink-muted uppercase">
              <tr>
                <th className="py-1 pr-2">Line</th>
                <th className="py-1 pr-2">Field</th>
                <th className="py-1 pr-2">Problem</th>
                <th className="py-1 pr-2">Expected</th>
                <th className="py-1">Found</th>
              </tr>
            </thead>
            <tbody>
              {fileIssues.map((issue) => (
                <tr
                  key={`${issue.line}-${issue.field}-${issue.message}`}
                  className="border-t border-canvas-line align-top"
                >
                  <td className="py-1 pr-2 tabular-nums">{issue.line ?? '–'}</td>
                  <td className="py-1 pr-2 font-mono text-xs">{issue.field ?? '–'}</td>
                  <td className="py-1 pr-2">
                    <span className="inline-flex items-start gap-1">
                      {issue.severity === 'warning' ? (
                        <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0 text-state-warn" />
                      ) : (
                        <CircleAlert aria-hidden className="mt-0.5 size-4 shrink-0 text-state-bad" />
                      )}
                      <span>
                        <span className="sr-only">
                          {issue.severity === 'warning' ? 'Warning: ' : 'Error: '}
                        </span>
                        {issue.message}
                      </span>
                    </span>
                  </td>
                  <td className="py-1 pr-2 font-mono text-xs">{issue.expected ?? '–'}</td>
                  <td className="py-1 font-mono text-xs">{issue.found ?? '–'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}
    </div>
  );
}

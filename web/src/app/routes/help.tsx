import { PageHeader } from '@web/components/page-header';
import { HelpView } from '@web/features/help/components/help-view';

/** The Help page: the workspace's keys and every term behind an info button, with sources. */
export function HelpRoute() {
  return (
    <>
      <PageHeader title="Help" description="What the workspace shows, and where each term comes from." />
      <HelpView />
    </>
  );
}

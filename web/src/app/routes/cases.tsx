import { useMe } from '@web/features/auth/api/get-me';
import { CaseListView } from '@web/features/cases/components/case-list-view';
import { CASE_CREATOR_ROLES } from '../shell/navigation';

export function CasesRoute() {
  const { data } = useMe();
  return <CaseListView canCreateCase={Boolean(data && CASE_CREATOR_ROLES.includes(data.user.role))} />;
}

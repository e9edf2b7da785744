import type { TUser } from '@shared/contracts/users';
import { ROLE_LABELS, type Role } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { ConfirmDialog } from '@web/components/confirm-dialog';
import { PageHeader } from '@web/components/page-header';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { UserPlus, Users } from 'lucide-react';
import { useState } from 'react';
import { useUsers } from '../api/get-users';
import { useUpdateUser } from '../api/update-user';
import { CreateUserDialog } from './create-user-dialog';
import { UsersTable } from './users-table';

export function UsersView({ currentUserId }: { currentUserId: string }) {
  const usersQuery = useUsers();
  const updateUser = useUpdateUser();
  const [isCreating, setIsCreating] = useState(false);
  const [toggling, setToggling] = useState<TUser>();
  const [notice, setNotice] = useState<string>();

  const changeRole = (user: TUser, role: Role) => {
    setNotice(undefined);
    updateUser.mutate(
      { userId: user.id, body: { role } },
      { onSuccess: (saved) => setNotice(`${saved.name} is now ${ROLE_LABELS[saved.role]}.`) },
    );
  };

  const confirmToggle = () => {
    if (!toggling) return;
    updateUser.mutate(
      { userId: toggling.id, body: { active: !toggling.active } },
      {
        onSuccess: (saved) => {
          setToggling(undefined);
          setNotice(`${saved.name} is ${saved.active ? 'reactivated' : 'deactivated'}.`);
        },
      },
    );
  };

  return (
    <>
      <PageHeader
        title="Users"
        description="Who can sign in, and what each role may do."
        actions={
          <Button variant="primary" icon={UserPlus} onClick={() => setIsCreating(true)}>
            Add user
          </Button>
        }
      />
      <div aria-live="polite" className="mb-3 empty:hidden">
        {notice && <Alert tone="info">{notice}</Alert>}
        {updateUser.isError && !toggling && <Alert>{updateUser.error.message}</Alert>}
      </div>
      <section
        aria-label="User accounts"
        className="overflow-hidden rounded-lg border border-canvas-line bg-canvas-raised shadow-sm"
      >
        {usersQuery.isError ? (
          <ErrorState
            error={usersQuery.error}
            title="Could not load users"
            onRetry={() => usersQuery.refetch()}
          />
        ) : !usersQuery.data ? (
          <div aria-busy className="space-y-3 p-4">
            {[1, 2, 3, 4].map((row) => (
              <SkeletonBar key={row} className="w-full" />
            ))}
          </div>
        ) : usersQuery.data.items.length === 0 ? (
          <EmptyState icon={Users} title="No users" />
        ) : (
          <UsersTable
            users={usersQuery.data.items}
            currentUserId={currentUserId}
            pendingUserId={updateUser.isPending ? updateUser.variables?.userId : undefined}
            onChangeRole={changeRole}
            onToggleActive={(user) => {
              updateUser.reset();
              setToggling(user);
            }}
          />
        )}
      </section>
      <CreateUserDialog isOpen={isCreating} onClose={() => setIsCreating(false)} />
      <ConfirmDialog
        isOpen={Boolean(toggling)}
        title={toggling?.active ? `Deactivate ${toggling?.name}?` : `Reactivate ${toggling?.name}?`}
        confirmLabel={toggling?.active ? 'Deactivate' : 'Reactivate'}
        tone={toggling?.active ? 'danger' : 'primary'}
        isBusy={updateUser.isPending}
        errorMessage={updateUser.isError ? updateUser.error.message : undefined}
        onConfirm={confirmToggle}
        onCancel={() => setToggling(undefined)}
      >
        {toggling?.active
          ? 'They will be signed out and cannot sign in until reactivated. Their cases and records stay as they are.'
          : 'They will be able to sign in again with their existing password.'}
      </ConfirmDialog>
    </>
  );
}

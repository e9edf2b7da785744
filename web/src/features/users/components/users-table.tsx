import type { TUser } from '@shared/contracts/users';
import { ROLE_LABELS, ROLES, type Role } from '@shared/roles';
import { Button } from '@web/components/button';
import { SelectInput } from '@web/components/inputs';
import { LocalTime } from '@web/components/local-time';
import { CircleCheck, CircleSlash } from 'lucide-react';

interface UsersTableProps {
  users: TUser[];
  currentUserId: string;
  pendingUserId?: string;
  onChangeRole: (user: TUser, role: Role) => void;
  onToggleActive: (user: TUser) => void;
}

const HEAD = 'px-3 py-2 text-left text-xs font-bold text-ink-muted';
const CELL = 'px-3 py-2 align-middle';

function ActiveState({ isActive }: { isActive: boolean }) {
  const Icon = isActive ? CircleCheck : CircleSlash;
  return (
    <span
      className={`inline-flex items-center gap-1 text-sm ${isActive ? 'text-state-ok' : 'text-ink-muted'}`}
    >
      <Icon aria-hidden className="size-4" />
      {isActive ? 'Active' : 'Deactivated'}
    </span>
  );
}

export function UsersTable({
  users,
  currentUserId,
  pendingUserId,
  onChangeRole,
  onToggleActive,
}: UsersTableProps) {
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">User accounts</caption>
      <thead className="bg-canvas-sunk/60">
        <tr>
          <th scope="col" className={HEAD}>
            Name
          </th>
          <th scope="col" className={HEAD}>
            E-mail
          </th>
          <th scope="col" className={HEAD}>
            Role
          </th>
          <th scope="col" className={HEAD}>
            State
          </th>
          <th scope="col" className={HEAD}>
            Added
          </th>
          <th scope="col" className={`${HEAD} text-right`}>
            Access
          </th>
        </tr>
      </thead>
      <tbody>
        {users.map((user) => {
          // An admin cannot lock themselves out from this page; another admin must do it.
          const isSelf = user.id === currentUserId;
          return (
            <tr
              key={user.id}
              className={`border-t border-canvas-line ${user.active ? '' : 'text-ink-muted'}`}
            >
              <td className={`${CELL} font-bold`}>
                {user.name}
                {isSelf && <span className="ml-2 text-xs font-normal text-ink-muted">(you)</span>}
              </td>
              <td className={CELL}>{user.email}</td>
              <td className={CELL}>
                <SelectInput
                  aria-label={`Role of ${user.name}`}
                  density="compact"
                  className="w-44"
                  value={user.role}
                  disabled={isSelf || pendingUserId === user.id}
                  title={isSelf ? 'You cannot change your own role' : undefined}
                  onChange={(event) => onChangeRole(user, event.target.value as Role)}
                >
                  {ROLES.map((role) => (
                    <option key={role} value={role}>
                      {ROLE_LABELS[role]}
                    </option>
                  ))}
                </SelectInput>
              </td>
              <td className={CELL}>
                <ActiveState isActive={user.active} />
              </td>
              <td className={CELL}>
                <LocalTime iso={user.createdAt} />
              </td>
              <td className={`${CELL} text-right`}>
                <Button
                  size="sm"
                  variant={user.active ? 'secondary' : 'ghost'}
                  disabled={isSelf}
                  title={isSelf ? 'You cannot deactivate your own account' : undefined}
                  onClick={() => onToggleActive(user)}
                  aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
                >
                  {user.active ? 'Deactivate' : 'Reactivate'}
                </Button>
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

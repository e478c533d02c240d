import type { UserSummary } from '../../../shared/users';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../components/ui/alert';
import { formatDate } from '../../../lib/format';
import { useUpdateUser } from '../api/update-user';
import { UserStatus } from './user-status';

export function UserRow({ user, isSelf }: { user: UserSummary; isSelf: boolean }) {
  const update = useUpdateUser();
  const name = user.displayName || user.email;

  return (
    <tr className="align-top">
      <td className="py-3 pr-4">
        <p className="font-semibold text-ink-900">
          {name} {isSelf && <span className="font-normal text-ink-600">(you)</span>}
        </p>
        <p className="text-sm text-ink-600">{user.email}</p>
        {update.error && (
          <p role="alert" className="mt-1 text-sm font-semibold text-alert-700">
            {errorMessage(update.error)}
          </p>
        )}
      </td>
      <td className="py-3 pr-4">
        <UserStatus user={user} />
      </td>
      <td className="py-3 pr-4">
        <input
          type="checkbox"
          aria-label={`Site admin: ${name}`}
          checked={user.isAdmin}
          disabled={update.isPending}
          onChange={(e) => update.mutate({ userId: user.id, isAdmin: e.target.checked })}
          className="size-4 accent-ink-700"
        />
      </td>
      <td className="py-3 pr-4 text-sm text-ink-600">{formatDate(user.createdAt)}</td>
      <td className="py-3 text-right">
        <Button
          size="sm"
          variant={user.disabled ? 'secondary' : 'danger'}
          aria-label={`${user.disabled ? 'Enable' : 'Disable'} ${name}`}
          pending={update.isPending}
          onClick={() => update.mutate({ userId: user.id, disabled: !user.disabled })}
        >
          {user.disabled ? 'Enable' : 'Disable'}
        </Button>
      </td>
    </tr>
  );
}

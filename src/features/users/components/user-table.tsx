import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { useUsers } from '../api/get-users';
import { UserRow } from './user-row';

export function UserTable({ currentUserId }: { currentUserId: number }) {
  const users = useUsers();

  if (users.isPending) return <Loading label="Loading accounts…" />;
  if (users.isError) return <ErrorAlert error={users.error} />;

  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left">
        <caption className="sr-only">Accounts</caption>
        <thead className="border-b border-paper-300 text-xs uppercase tracking-wide text-ink-600">
          <tr>
            <th scope="col" className="py-2 pr-4 font-semibold">Person</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Status</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Admin</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Created</th>
            <th scope="col" className="py-2 font-semibold"><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-200">
          {users.data.map((user) => (
            <UserRow key={user.id} user={user} isSelf={user.id === currentUserId} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

import { useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import type { UserView } from '@shared/schemas/users';
import { ROLES, type Role } from '@shared/domain/vocabulary';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { usersQueryOptions, useUsers } from '@/features/users/api/get-users';
import { useUpdateUser } from '@/features/users/api/save-user';
import { UserForm } from '@/features/users/components/user-form';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(usersQueryOptions());

const col = createColumnHelper<UserView>();

function RoleSelect({ user }: { user: UserView }) {
  const update = useUpdateUser();
  return (
    <select
      aria-label={`Role of ${user.name}`}
      className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2"
      value={user.role}
      onClick={(e) => e.stopPropagation()}
      onChange={(e) => update.mutate({ id: user.id, patch: { role: e.target.value as Role } }, { onError: (err) => alert(err.message) })}
    >
      {ROLES.map((r) => (
        <option key={r} value={r}>
          {r}
        </option>
      ))}
    </select>
  );
}

function UserActions({ user }: { user: UserView }) {
  const update = useUpdateUser();
  const [pin, setPin] = useState('');
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Button
        variant={user.active ? 'secondary' : 'primary'}
        onClick={() => update.mutate({ id: user.id, patch: { active: !user.active } }, { onError: (err) => alert(err.message) })}
      >
        {user.active ? 'Switch off' : 'Switch on'}
      </Button>
      <form
        className="flex items-center gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          update.mutate({ id: user.id, patch: { pin } }, { onSuccess: () => setPin(''), onError: (err) => alert(err.message) });
        }}
      >
        <input
          aria-label={`New PIN for ${user.name}`}
          placeholder="New PIN"
          inputMode="numeric"
          type="password"
          value={pin}
          onChange={(e) => setPin(e.target.value.replace(/\D/g, '').slice(0, 8))}
          className="min-h-11 w-28 rounded-lg border-2 border-harbour-100 bg-white px-2"
        />
        <Button type="submit" variant="ghost" disabled={pin.length < 4}>
          Reset PIN
        </Button>
      </form>
    </div>
  );
}

const columns = [
  col.accessor('name', { header: 'Name' }),
  col.accessor('email', { header: 'E-mail' }),
  col.accessor('role', { header: 'Role', cell: (c) => <RoleSelect user={c.row.original} /> }),
  col.accessor('badge', { header: 'Badge', cell: (c) => c.getValue() ?? '—' }),
  col.accessor('active', { header: 'State', cell: (c) => (c.getValue() ? <Pill tone="ok">Active</Pill> : <Pill tone="stop">Switched off</Pill>) }),
  col.accessor('lastLoginAt', { header: 'Last sign-in', cell: (c) => (c.getValue() ? new Date(c.getValue()!).toLocaleString() : 'never') }),
  col.display({ id: 'actions', header: 'Actions', cell: (c) => <UserActions user={c.row.original} /> }),
];

export function Component() {
  const users = useUsers();
  const [adding, setAdding] = useState(false);
  return (
    <>
      <PageHeader
        title="People"
        subtitle="Who can sign in, with which role. Operators also get a badge and PIN for the station tablets."
        actions={<Button onClick={() => setAdding((a) => !a)}>{adding ? 'Close' : 'Add a person'}</Button>}
      />
      {adding && (
        <Card className="mb-6">
          <UserForm onDone={() => setAdding(false)} />
        </Card>
      )}
      {users.isPending ? <Loading /> : users.error ? <ErrorPanel message={users.error.message} /> : <DataTable data={users.data} columns={columns} filterLabel="Find a person" caption="People" />}
    </>
  );
}

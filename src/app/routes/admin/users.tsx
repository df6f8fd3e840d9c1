import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { createColumnHelper } from '@tanstack/react-table';
import type { UserView } from '@shared/schemas/users';
import { LOCALES, ROLES, type Locale, type Role } from '@shared/domain/vocabulary';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { errorText } from '@/lib/error-text';
import { formatDateTime } from '@/lib/labels';
import { usersQueryOptions, useUsers } from '@/features/users/api/get-users';
import { useUpdateUser } from '@/features/users/api/save-user';
import { UserForm } from '@/features/users/components/user-form';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(usersQueryOptions());

const col = createColumnHelper<UserView>();
const LANGUAGE_NAMES: Record<Locale, string> = { en: 'English', 'zh-CN': '简体中文' };
const select = 'min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2';

/** A role change ends the person's sessions, so it is asked once more before it is saved. */
function RoleSelect({ user }: { user: UserView }) {
  const { t } = useTranslation(['users', 'common']);
  const update = useUpdateUser();
  const [pending, setPending] = useState<Role | null>(null);
  return (
    <div className="flex flex-col gap-2" onClick={(e) => e.stopPropagation()}>
      <select
        aria-label={t('roleOf', { name: user.name })}
        className={select}
        value={pending ?? user.role}
        onChange={(e) => setPending(e.target.value === user.role ? null : (e.target.value as Role))}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {t(`common:role.${r}`)}
          </option>
        ))}
      </select>
      {pending && (
        <div role="alertdialog" aria-label={t('confirm')} className="flex max-w-xs flex-col gap-2 rounded-lg border-2 border-warn-700/40 bg-warn-50 p-2">
          <p className="text-sm">{t('confirmRole', { name: user.name, role: t(`common:role.${pending}`) })}</p>
          <div className="flex flex-wrap gap-2">
            <Button
              disabled={update.isPending}
              onClick={() =>
                update.mutate({ id: user.id, patch: { role: pending } }, { onSuccess: () => setPending(null), onError: (err) => alert(errorText(err)) })
              }
            >
              {t('confirm')}
            </Button>
            <Button variant="secondary" onClick={() => setPending(null)}>
              {t('cancel', { role: t(`common:role.${user.role}`) })}
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}

function LanguageSelect({ user }: { user: UserView }) {
  const { t } = useTranslation(['users', 'common']);
  const update = useUpdateUser();
  return (
    <select
      aria-label={t('languageOf', { name: user.name })}
      className={select}
      value={user.locale}
      onClick={(e) => e.stopPropagation()}
      onChange={(e) => update.mutate({ id: user.id, patch: { locale: e.target.value as Locale } }, { onError: (err) => alert(errorText(err)) })}
    >
      {LOCALES.map((l) => (
        <option key={l} value={l} lang={l}>
          {LANGUAGE_NAMES[l]}
        </option>
      ))}
    </select>
  );
}

function UserActions({ user }: { user: UserView }) {
  const { t } = useTranslation(['users', 'common']);
  const update = useUpdateUser();
  const [pin, setPin] = useState('');
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Button
        variant={user.active ? 'secondary' : 'primary'}
        onClick={() => update.mutate({ id: user.id, patch: { active: !user.active } }, { onError: (err) => alert(errorText(err)) })}
      >
        {user.active ? t('switchOff') : t('switchOn')}
      </Button>
      <form
        className="flex items-center gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          update.mutate({ id: user.id, patch: { pin } }, { onSuccess: () => setPin(''), onError: (err) => alert(errorText(err)) });
        }}
      >
        <input
          aria-label={t('newPinFor', { name: user.name })}
          placeholder={t('newPin')}
          inputMode="numeric"
          type="password"
          value={pin}
          onChange={(e) => setPin(e.target.value.replace(/\D/g, '').slice(0, 8))}
          className="min-h-11 w-28 rounded-lg border-2 border-harbour-100 bg-white px-2"
        />
        <Button type="submit" variant="ghost" disabled={pin.length < 4}>
          {t('resetPin')}
        </Button>
      </form>
    </div>
  );
}

export function Component() {
  const { t } = useTranslation(['users', 'common']);
  const users = useUsers();
  const [adding, setAdding] = useState(false);
  const columns = [
    col.accessor('name', { header: t('col.name') }),
    col.accessor('email', { header: t('col.email') }),
    col.accessor('role', { header: t('col.role'), cell: (c) => <RoleSelect user={c.row.original} /> }),
    col.accessor('locale', { header: t('col.language'), cell: (c) => <LanguageSelect user={c.row.original} /> }),
    col.accessor('badge', { header: t('col.badge'), cell: (c) => c.getValue() ?? '—' }),
    col.accessor('active', {
      header: t('col.state'),
      cell: (c) => (c.getValue() ? <Pill tone="ok">{t('active')}</Pill> : <Pill tone="stop">{t('off')}</Pill>),
    }),
    col.accessor('lastLoginAt', { header: t('col.lastSignIn'), cell: (c) => (c.getValue() ? formatDateTime(c.getValue()) : t('never')) }),
    col.display({ id: 'actions', header: t('col.actions'), cell: (c) => <UserActions user={c.row.original} /> }),
  ];
  return (
    <>
      <PageHeader
        title={t('title')}
        subtitle={t('subtitle')}
        actions={<Button onClick={() => setAdding((a) => !a)}>{adding ? t('close') : t('add')}</Button>}
      />
      {adding && (
        <Card className="mb-6">
          <UserForm onDone={() => setAdding(false)} />
        </Card>
      )}
      {users.isPending ? (
        <Loading />
      ) : users.error ? (
        <ErrorPanel message={errorText(users.error)} />
      ) : (
        <DataTable data={users.data} columns={columns} filterLabel={t('find')} caption={t('caption')} />
      )}
    </>
  );
}

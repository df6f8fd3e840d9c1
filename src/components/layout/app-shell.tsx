import { useEffect } from 'react';
import { NavLink, Outlet, useMatches, useNavigate, useNavigation } from 'react-router';
import { useTranslation } from 'react-i18next';
import { LogOut } from 'lucide-react';
import { useMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-in';
import { useSetLocale } from '@/features/auth/api/set-locale';
import { NAV } from '@/config/nav';
import { paths } from '@/config/paths';
import { applyLocale, currentLocale } from '@/lib/i18n';
import { Forbidden } from './forbidden';
import { LanguageSwitch } from './language-switch';
import { NavMenu } from './nav-menu';
import type { Role } from '@shared/domain/vocabulary';

export interface RouteHandle {
  /** roles that may open this screen; the server enforces the same on its API */
  roles?: readonly Role[];
}

export function AppShell() {
  const { t } = useTranslation();
  const { data } = useMe();
  const matches = useMatches();
  const navigation = useNavigation();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const setLocale = useSetLocale();
  const user = data?.user;
  const locale = user?.locale;
  // the person's own language, also after the station tablet switched the shared instance
  useEffect(() => {
    if (locale) applyLocale(locale);
  }, [locale]);
  if (!user) return null;
  const required = matches
    .map((m) => (m.handle as RouteHandle | undefined)?.roles)
    .filter(Boolean)
    .at(-1);
  const allowed = !required || required.includes(user.role);

  return (
    <div className="flex min-h-full flex-col">
      <header className="bg-harbour-800 text-white">
        <div className="mx-auto flex max-w-[1600px] flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2">
          <NavLink to={paths.home} className="flex min-h-11 items-center gap-2 text-xl font-bold">
            <img src="/favicon.svg" alt="" className="h-8 w-8" />
            {t('app.name')}
          </NavLink>
          <NavMenu groups={NAV} role={user.role} />
          <div className="flex items-center gap-3">
            <span className="text-sm">
              <span className="font-bold">{user.name}</span> · {t(`role.${user.role}`)}
            </span>
            <LanguageSwitch
              value={locale ?? currentLocale()}
              disabled={setLocale.isPending}
              onChange={(l) => {
                applyLocale(l);
                setLocale.mutate({ locale: l });
              }}
            />
            <button
              type="button"
              className="flex min-h-11 items-center gap-2 whitespace-nowrap rounded-lg px-3 font-bold hover:bg-harbour-700"
              onClick={() => signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn) })}
            >
              <LogOut className="h-5 w-5" aria-hidden /> {t('app.signOut')}
            </button>
          </div>
        </div>
        {navigation.state === 'loading' && <div className="h-1 animate-pulse bg-brass-400" role="progressbar" aria-label={t('app.loadingPage')} />}
      </header>
      <main className="mx-auto w-full max-w-[1600px] flex-1 px-4 py-6">{allowed ? <Outlet /> : <Forbidden />}</main>
    </div>
  );
}

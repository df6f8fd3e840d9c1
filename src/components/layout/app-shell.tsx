import { NavLink, Outlet, useMatches, useNavigate, useNavigation } from 'react-router';
import { LogOut } from 'lucide-react';
import { useMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-in';
import { NAV } from '@/config/nav';
import { paths } from '@/config/paths';
import { Forbidden } from './forbidden';
import type { Role } from '@shared/domain/vocabulary';

export interface RouteHandle {
  /** roles that may open this screen; the server enforces the same on its API */
  roles?: readonly Role[];
}

const ROLE_LABEL: Record<Role, string> = {
  operator: 'Operator',
  supervisor: 'Supervisor',
  planner: 'Planner',
  manager: 'Manager',
  sales: 'Sales',
  admin: 'Administrator',
};

export function AppShell() {
  const { data } = useMe();
  const matches = useMatches();
  const navigation = useNavigation();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const user = data?.user;
  if (!user) return null;
  const required = matches.map((m) => (m.handle as RouteHandle | undefined)?.roles).filter(Boolean).at(-1);
  const allowed = !required || required.includes(user.role);
  const items = NAV.filter((n) => n.roles.includes(user.role));

  return (
    <div className="flex min-h-full flex-col">
      <header className="bg-harbour-800 text-white">
        <div className="mx-auto flex max-w-[1600px] flex-wrap items-center gap-4 px-4 py-2">
          <NavLink to={paths.home} className="flex min-h-11 items-center gap-2 text-xl font-bold">
            <img src="/favicon.svg" alt="" className="h-8 w-8" />
            Trayce
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            {items.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  `flex min-h-11 items-center gap-1.5 rounded-lg px-2.5 text-[0.95rem] font-bold ${isActive ? 'bg-brass-400 text-harbour-900' : 'text-white hover:bg-harbour-700'}`
                }
              >
                <item.icon className="h-5 w-5" aria-hidden />
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="flex items-center gap-3">
            <span className="text-sm">
              <span className="font-bold">{user.name}</span> · {ROLE_LABEL[user.role]}
            </span>
            <button
              type="button"
              className="flex min-h-11 items-center gap-2 rounded-lg px-3 font-bold hover:bg-harbour-700"
              onClick={() => signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn) })}
            >
              <LogOut className="h-5 w-5" aria-hidden /> Sign out
            </button>
          </div>
        </div>
        {navigation.state === 'loading' && <div className="h-1 animate-pulse bg-brass-400" role="progressbar" aria-label="Loading page" />}
      </header>
      <main className="mx-auto w-full max-w-[1600px] flex-1 px-4 py-6">{allowed ? <Outlet /> : <Forbidden />}</main>
    </div>
  );
}

import { NavLink, Outlet } from 'react-router';
import { ADMIN_SECTIONS } from '@/config/nav';

/** The admin area: one menu entry, its sections as tabs. */
export function AdminLayout() {
  return (
    <div>
      <nav aria-label="Administration" className="mb-6 flex flex-wrap gap-1 border-b-2 border-harbour-100">
        {ADMIN_SECTIONS.map((s) => (
          <NavLink
            key={s.to}
            to={s.to}
            className={({ isActive }) =>
              `-mb-0.5 flex min-h-11 items-center gap-2 border-b-4 px-3 font-bold ${isActive ? 'border-brass-400 text-harbour-900' : 'border-transparent text-harbour-700 hover:text-harbour-900'}`
            }
          >
            <s.icon className="h-5 w-5" aria-hidden />
            {s.label}
          </NavLink>
        ))}
      </nav>
      <Outlet />
    </div>
  );
}

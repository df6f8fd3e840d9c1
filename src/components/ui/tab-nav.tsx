import { NavLink } from 'react-router';
import type { LucideIcon } from 'lucide-react';

/** Tabs that are links (an area's sections): the active one underlined in brass. */
export function TabNav({ label, items }: { label: string; items: { to: string; label: string; icon: LucideIcon; end?: boolean }[] }) {
  return (
    <nav aria-label={label} className="mb-6 flex flex-wrap gap-1 border-b-2 border-harbour-100">
      {items.map((item) => (
        <NavLink
          key={item.to}
          to={item.to}
          end={item.end}
          className={({ isActive }) =>
            `-mb-0.5 flex min-h-11 items-center gap-2 border-b-4 px-3 font-bold ${isActive ? 'border-brass-400 text-harbour-900' : 'border-transparent text-harbour-700 hover:text-harbour-900'}`
          }
        >
          <item.icon className="h-5 w-5" aria-hidden />
          {item.label}
        </NavLink>
      ))}
    </nav>
  );
}

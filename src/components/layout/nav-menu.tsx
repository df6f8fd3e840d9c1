import { useEffect, useId, useRef, useState } from 'react';
import { NavLink, useLocation } from 'react-router';
import { useTranslation } from 'react-i18next';
import { ChevronDown } from 'lucide-react';
import type { NavGroup, NavItem } from '@/config/nav';

const linkClass = (active: boolean) =>
  `flex min-h-11 items-center gap-1.5 whitespace-nowrap rounded-lg px-2.5 text-[0.95rem] font-bold ${active ? 'bg-brass-400 text-harbour-900' : 'text-white hover:bg-harbour-700'}`;

/** A group of menu entries behind one button (a disclosure): opens on click, closes on Escape, a click outside or a page change. */
function GroupMenu({ group, items }: { group: NavGroup; items: NavItem[] }) {
  const { t } = useTranslation();
  const [open, setOpen] = useState(false);
  const location = useLocation();
  const ref = useRef<HTMLDivElement>(null);
  const id = useId();
  const active = items.some((i) => location.pathname === i.to || location.pathname.startsWith(`${i.to}/`));

  useEffect(() => setOpen(false), [location.pathname]);
  useEffect(() => {
    if (!open) return;
    const onDown = (e: PointerEvent) => !ref.current?.contains(e.target as Node) && setOpen(false);
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && setOpen(false);
    document.addEventListener('pointerdown', onDown);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onDown);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  return (
    <div ref={ref} className="relative">
      <button type="button" aria-expanded={open} aria-controls={id} className={linkClass(active)} onClick={() => setOpen((o) => !o)}>
        <group.icon className="h-5 w-5" aria-hidden />
        {t(`nav.${group.label}`)}
        <ChevronDown className={`h-4 w-4 transition-transform ${open ? 'rotate-180' : ''}`} aria-hidden />
      </button>
      <ul id={id} hidden={!open} className="absolute left-0 top-full z-30 mt-1 min-w-56 rounded-lg border border-harbour-600 bg-harbour-800 p-1 shadow-xl">
        {items.map((item) => (
          <li key={item.to}>
            <NavLink to={item.to} className={({ isActive }) => linkClass(isActive)}>
              <item.icon className="h-5 w-5" aria-hidden />
              {t(`nav.${item.label}`)}
            </NavLink>
          </li>
        ))}
      </ul>
    </div>
  );
}

/** The main menu for one role: groups with several entries open as a list, single entries are plain links. */
export function NavMenu({ groups, role }: { groups: NavGroup[]; role: NavItem['roles'][number] }) {
  const { t } = useTranslation();
  return (
    <nav aria-label={t('app.mainMenu')} className="flex flex-1 flex-wrap items-center gap-1">
      {groups.map((g) => {
        const items = g.items.filter((i) => i.roles.includes(role));
        if (items.length === 0) return null;
        if (items.length === 1)
          return (
            <NavLink key={g.label} to={items[0].to} className={({ isActive }) => linkClass(isActive)}>
              {(() => {
                const Icon = items[0].icon;
                return <Icon className="h-5 w-5" aria-hidden />;
              })()}
              {t(`nav.${items[0].label}`)}
            </NavLink>
          );
        return <GroupMenu key={g.label} group={g} items={items} />;
      })}
    </nav>
  );
}

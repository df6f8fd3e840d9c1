import { createContext, useContext, type ReactNode } from 'react';
import { createPortal } from 'react-dom';

/** Where the station screen's fixed action bar takes buttons (null: no bar, buttons stay in place). */
export const ActionBarSlot = createContext<HTMLElement | null>(null);

/** Puts its buttons in the screen's fixed action bar, so they stay in view whatever the screen scrolls. */
export function InActionBar({ children }: { children: ReactNode }) {
  const slot = useContext(ActionBarSlot);
  return slot ? createPortal(children, slot) : <div className="flex flex-wrap gap-3">{children}</div>;
}

/** One large button of the action bar. */
export const barButton = (tone: 'primary' | 'plain' | 'warn' | 'brass') =>
  `flex min-h-16 flex-1 basis-36 items-center justify-center gap-2 whitespace-nowrap rounded-2xl px-3 text-xl font-bold disabled:opacity-50 ${
    tone === 'primary'
      ? 'bg-harbour-800 text-white'
      : tone === 'warn'
        ? 'bg-warn-700 text-white'
        : tone === 'brass'
          ? 'bg-brass-700 text-white'
          : 'bg-white text-harbour-800 ring-2 ring-harbour-800'
  }`;

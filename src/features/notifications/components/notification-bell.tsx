import { useEffect, useId, useRef, useState } from 'react';
import { useNotifications } from '../api/get-notifications';
import { useMarkRead } from '../api/mark-read';
import { useNotificationEvents } from '../hooks/use-notification-events';
import { NotificationList } from './notification-list';

/** The bell in the header: unread count, live; opens the list of notifications. */
export function NotificationBell() {
  useNotificationEvents();
  const list = useNotifications();
  const markRead = useMarkRead();
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const root = useRef<HTMLDivElement>(null);
  const unread = list.data?.unread ?? 0;

  useEffect(() => {
    if (!open) return;
    const close = (e: MouseEvent | KeyboardEvent) => {
      if (e instanceof KeyboardEvent ? e.key === 'Escape' : !root.current?.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener('mousedown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('mousedown', close);
      document.removeEventListener('keydown', close);
    };
  }, [open]);

  return (
    <div ref={root} className="relative">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        aria-label={unread ? `Notifications, ${unread} unread` : 'Notifications'}
        onClick={() => setOpen((o) => !o)}
        className="relative grid size-8 place-items-center rounded-md text-ink-700 hover:bg-paper-200"
      >
        <svg aria-hidden="true" viewBox="0 0 24 24" className="size-5" fill="none" stroke="currentColor" strokeWidth={2} strokeLinecap="round" strokeLinejoin="round">
          <path d="M6 8a6 6 0 1 1 12 0c0 7 3 9 3 9H3s3-2 3-9" />
          <path d="M10.3 21a1.94 1.94 0 0 0 3.4 0" />
        </svg>
        {unread > 0 && (
          <span data-testid="unread-count" className="absolute -top-1 -right-1 min-w-4 rounded-full bg-alert-700 px-1 text-[0.65rem] leading-4 font-bold text-paper-50">
            {unread > 99 ? '99+' : unread}
          </span>
        )}
      </button>
      {open && (
        <div id={panelId} className="absolute right-0 z-20 mt-2 w-80 rounded-lg border border-paper-300 bg-paper-50 shadow-card">
          <NotificationList
            list={list}
            onMarkAll={() => markRead.mutate({ all: true })}
            onOpenItem={(id) => {
              markRead.mutate({ ids: [id] });
              setOpen(false);
            }}
          />
        </div>
      )}
    </div>
  );
}

import { Link } from 'react-router';
import type { UseQueryResult } from '@tanstack/react-query';
import type { NotificationItem, NotificationList as List } from '../../../shared/notifications';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { cn } from '../../../lib/cn';
import { paths } from '../../../lib/paths';

const href = (n: NotificationItem) => paths.mapping(n.mappingId, { bead: n.beadId, thread: String(n.threadId) });
const what = (n: NotificationItem) => `${n.actor?.displayName ?? 'Someone'} ${n.kind === 'mention' ? 'mentioned you' : 'replied'} in ${n.mappingName}`;

interface Props {
  list: UseQueryResult<List>;
  onMarkAll(): void;
  onOpenItem(id: number): void;
}

/** The bell's list: newest first, unread ones marked; each opens the editor on its thread. */
export function NotificationList({ list, onMarkAll, onOpenItem }: Props) {
  const items = list.data?.items ?? [];
  return (
    <section aria-label="Notifications" className="flex max-h-96 flex-col">
      <div className="flex items-center justify-between border-b border-paper-200 px-3 py-2">
        <h2 className="text-sm font-bold text-ink-800">Notifications</h2>
        {!!list.data?.unread && (
          <Button size="sm" variant="ghost" onClick={onMarkAll}>
            Mark all read
          </Button>
        )}
      </div>
      {list.isError && <ErrorAlert error={list.error} />}
      {!items.length && !list.isError && <p className="px-3 py-4 text-sm text-ink-600">Nothing yet. Mentions and replies to your threads show up here.</p>}
      <ul className="overflow-y-auto">
        {items.map((n) => (
          <li key={n.id}>
            <Link
              to={href(n)}
              onClick={() => onOpenItem(n.id)}
              className={cn('block border-b border-paper-200 px-3 py-2 text-sm hover:bg-ink-50', !n.readAt && 'bg-ink-50/60')}
              aria-label={`${n.readAt ? '' : 'Unread: '}${what(n)}`}
            >
              <span className={cn('block text-ink-900', !n.readAt && 'font-semibold')}>{what(n)}</span>
              {n.excerpt && <span className="block truncate text-xs text-ink-600">{n.excerpt}</span>}
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}

import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { useMarkNotificationsRead, useNotifications } from '../api/remarks';
import { formatDateTime } from '@/lib/format-date';

/** What the user has been told: remarks, answers, new players, new assignments. */
export function NotificationList() {
  const { data } = useNotifications();
  const markRead = useMarkNotificationsRead();
  if (!data || data.notifications.length === 0) return null;
  return (
    <section aria-labelledby="news-heading" className="grid gap-2" data-testid="notifications">
      <div className="flex items-center gap-3">
        <h2 id="news-heading" className="text-lead font-bold">
          News{' '}
          {data.unread > 0 ? (
            <span className="rounded-full bg-ember-700 px-2 text-caption text-white">{data.unread} new</span>
          ) : null}
        </h2>
        {data.unread > 0 ? (
          <Button variant="quiet" onClick={() => markRead.mutate()} disabled={markRead.isPending}>
            Mark all read
          </Button>
        ) : null}
      </div>
      <ul className="grid gap-1">
        {data.notifications.slice(0, 8).map((n) => (
          <li key={n.id} className={n.read ? 'text-muted' : 'font-semibold'}>
            <Link to={n.link} className="underline-offset-4 hover:underline">
              {n.text}
            </Link>{' '}
            <span className="text-caption text-muted">{formatDateTime(n.createdAt)}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}

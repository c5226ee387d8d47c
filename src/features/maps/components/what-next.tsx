import { drillMaterial } from '@shared/practice/drill-identity';
import { Link } from 'react-router-dom';
import { useWhatNext } from '../api/maps';
import { pct } from './heat';

/** The weakest (key, pattern) cells and the keys not yet played, each a link to a practice take. */
export function WhatNext() {
  const { data, error } = useWhatNext();
  if (error) return <p role="alert">{error.message}</p>;
  if (!data) return null;
  if (data.items.length === 0)
    return <p className="text-muted">Play a few takes; the keys that need work will show up here.</p>;
  return (
    <ol className="grid gap-2 md:grid-cols-3" data-testid="what-next">
      {data.items.map((item) => {
        const to = item.spec
          ? `/practice?${new URLSearchParams({ spec: JSON.stringify(item.spec), order: 'chromatic' })}`
          : '/practice';
        return (
          <li key={`${item.key}-${item.pattern}`}>
            <Link to={to} className="block rounded-card border border-line bg-raised p-4 hover:border-brass-500">
              <span className="block font-bold">
                {item.key} · {item.pattern}
                {item.spec?.changes ? ` · over ${drillMaterial(item.spec)}` : ''}
              </span>
              <span className="block text-caption text-muted">
                {item.reason === 'weak'
                  ? `${pct(item.rate ?? 0)} not hit over ${item.notes} notes; last played ${item.daysSince === 0 ? 'today' : `${item.daysSince} days ago`}`
                  : 'Not played in this key yet'}
              </span>
            </Link>
          </li>
        );
      })}
    </ol>
  );
}

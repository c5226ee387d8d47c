import type { Drill } from '@shared/engine';
import { useMemo } from 'react';
import { DrillStaff } from '@/components/notation/drill-staff';
import { type LiveMarks, useLiveMarks } from '../lib/live-marks';
import { markClass } from '../lib/take-session';

/** The staff of the running take: the only part of the page a played note re-renders. */
export function LiveStaff({ drill, live }: { drill: Drill; live: LiveMarks }) {
  const { marks, current } = useLiveMarks(live, drill);
  const classes = useMemo(() => new Map([...marks].map(([i, m]) => [i, markClass(m)])), [marks]);
  return <DrillStaff drill={drill} marks={classes} current={current} />;
}

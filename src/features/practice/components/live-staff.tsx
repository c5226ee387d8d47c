import type { Drill } from '@shared/engine';
import { DrillStaff } from '@/components/notation/drill-staff';
import { type LiveMarks, useLiveMarks } from '../lib/live-marks';

/** The staff of the running take: the only part of the page a played note re-renders. */
export function LiveStaff({ drill, live }: { drill: Drill; live: LiveMarks }) {
  const { marks, current } = useLiveMarks(live);
  return <DrillStaff drill={drill} marks={marks} current={current} />;
}

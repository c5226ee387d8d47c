import type { Drill } from '@shared/engine';
import { DrillStaff } from '@/components/notation/drill-staff';
import { type LiveMarks, useLiveMarks } from '../lib/live-marks';

/**
 * The staff of the running take: the only part of the page a played note re-renders. During a
 * take the staff carries the first downbeat's performance.now() time (data-downbeat-ms), so a
 * test or a tool can line its own clock up with the marks.
 */
export function LiveStaff({ drill, live, downbeatMs }: { drill: Drill; live: LiveMarks; downbeatMs: number | null }) {
  const { marks, current } = useLiveMarks(live, drill);
  return <DrillStaff drill={drill} verdicts={marks} current={current} downbeatMs={downbeatMs} />;
}

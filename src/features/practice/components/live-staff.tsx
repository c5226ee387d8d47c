import type { Drill } from '@shared/engine';
import { DrillStaff } from '@/components/notation/drill-staff';
import type { LiveMarks } from '../lib/live-marks';

/**
 * The staff of the running take: it paints each mark as the take's store changes, without a
 * render of its own. During a
 * take the staff carries the first downbeat's performance.now() time (data-downbeat-ms), so a
 * test or a tool can line its own clock up with the marks.
 */
export function LiveStaff({ drill, live, downbeatMs }: { drill: Drill; live: LiveMarks; downbeatMs: number | null }) {
  return <DrillStaff drill={drill} source={live} downbeatMs={downbeatMs} />;
}

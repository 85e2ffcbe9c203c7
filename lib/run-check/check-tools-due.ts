import { toolsPastDue, type DatedTool } from '../equipment/tools-past-due';
import type { RunCheckReason } from './types';

/**
 * Tools in date: every tool recorded for a run (torque wrench, tensioner pump gauge, load cell, …)
 * had its calibration in date on the run's day. A reading made with a tool past its due date, or
 * with no calibration on record, is held for review: the load it applied or measured cannot be
 * traced to a calibration. Keeping working tools in calibration is common practice (for hand torque
 * tools ISO 6789-1 and ISO 6789-2 set conformance and calibration: from memory); the centre's own
 * procedure sets the intervals, and the register's due dates are the centre's.
 *
 * Tools are recorded on the run report after the run is stored, so this rule runs when the run's
 * tools change (lib/data/equipment.ts), not in {@link checkRun}.
 */
export function checkToolsDue(tools: readonly DatedTool[], runDay: string): RunCheckReason | null {
  const late = toolsPastDue(tools, runDay);
  if (late.length === 0) return null;
  const described = late.map((tool) => (tool.dueOn === null ? `${tool.name} (no calibration on record)` : `${tool.name} (due ${tool.dueOn})`));
  return {
    rule: 'tool_past_due',
    message: `${described.join(', ')} ${late.length === 1 ? 'was' : 'were'} past calibration on the run's day, ${runDay}; check the readings against a tool in date before the run counts.`,
  };
}

/**
 * A run's review reasons after its tools changed: the tool reason replaced (or dropped), every
 * other reason kept in its place.
 */
export function withToolReason(reasons: readonly RunCheckReason[], toolReason: RunCheckReason | null): RunCheckReason[] {
  const others = reasons.filter((reason) => reason.rule !== 'tool_past_due');
  return toolReason ? [...others, toolReason] : others;
}

/** What {@link toolsPastDue} needs of a tool. */
export interface DatedTool {
  id: number;
  name: string;
  /** YYYY-MM-DD; null = no calibration on record. */
  dueOn: string | null;
}

/**
 * The tools whose calibration was past due on `date` (YYYY-MM-DD): due before that day, or with no
 * calibration on record. Due on the day itself still counts as in date. Pure, for the run page and
 * for the check before a run counts.
 *
 * @example
 * toolsPastDue([{ id: 1, name: 'Wrench', dueOn: '2026-03-01' }], '2026-03-02'); // [{ id: 1, … }]
 */
export function toolsPastDue<T extends DatedTool>(tools: readonly T[], date: string): T[] {
  return tools.filter((tool) => tool.dueOn === null || tool.dueOn < date);
}

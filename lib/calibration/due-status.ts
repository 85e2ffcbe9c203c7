/** Days before a due date from which it is shown as due soon (ours). */
export const DUE_SOON_DAYS = 30;

export type DueStatus = 'never' | 'overdue' | 'soon' | 'in-date';

/** Where a due date (YYYY-MM-DD, null = never calibrated) stands on `today` (YYYY-MM-DD). Due on the day itself is still in date. */
export function dueStatus(dueOn: string | null, today: string): DueStatus {
  if (dueOn === null) return 'never';
  if (dueOn < today) return 'overdue';
  const days = (Date.parse(`${dueOn}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000;
  return days <= DUE_SOON_DAYS ? 'soon' : 'in-date';
}

export const DUE_STATUS_LABEL: Record<DueStatus, string> = {
  never: 'never calibrated',
  overdue: 'overdue',
  soon: 'due soon',
  'in-date': 'in date',
};

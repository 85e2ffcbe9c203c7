/** The state every record action returns to its form (useActionState). */
export interface RecordActionState {
  ok: boolean;
  message: string;
  errors: Record<string, string[] | undefined>;
  runId?: number;
  /** Row and stud of a grid error, to mark the cell. */
  cell?: { row: number; column: string };
  /** A new bridge token, shown once. */
  token?: { id: number; value: string; jointId: number };
}

export const initialRecordState: RecordActionState = { ok: false, message: '', errors: {} };

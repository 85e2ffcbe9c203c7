import 'server-only';
import { UserPreference } from '@/models';
import type { SessionUser } from '../auth/session';
import { recordPreferencesSchema, type RecordPreferences } from '../record/record-preferences';

/** What Record remembers for this person (empty when nothing yet, or when the stored text no longer reads). */
export async function readRecordPreferences(user: SessionUser): Promise<RecordPreferences> {
  const row = await UserPreference.findByPk(user.id, { raw: true });
  if (!row) return {};
  let header: unknown;
  try {
    header = row.recordHeader ? JSON.parse(row.recordHeader) : undefined;
  } catch {
    header = undefined;
  }
  const parsed = recordPreferencesSchema.safeParse({ wayIn: row.recordWayIn ?? undefined, header });
  return parsed.success ? parsed.data : {};
}

/** Stores Record's way in and header for this person (one row per person, replaced whole). */
export async function saveRecordPreferences(user: SessionUser, input: unknown): Promise<void> {
  const prefs = recordPreferencesSchema.parse(input);
  await UserPreference.upsert({
    userId: user.id,
    recordWayIn: prefs.wayIn ?? null,
    recordHeader: prefs.header ? JSON.stringify(prefs.header) : null,
    updatedAt: new Date(),
  });
}

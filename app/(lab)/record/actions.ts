'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { RECORD_ROLES } from '@/lib/data/record';
import { createStreamToken, revokeStreamToken } from '@/lib/data/stream-tokens';
import { finishRecording, startRecording } from '@/lib/data/runs/live-stream';
import { saveManualRun } from '@/lib/data/runs/manual-run';
import { saveSimulatedRun } from '@/lib/data/runs/simulated-run';
import { saveRecordPreferences } from '@/lib/data/preferences';
import { okState, type FormState } from '@/lib/http/form-state';
import { parseFields, withActionRole } from '@/lib/http/server-action';

/** What the Record page's forms show after a success: the run to open, or a new bridge token (shown once). */
export interface RecordResult {
  runId?: number;
  token?: { id: number; value: string; jointId: number };
}
export type RecordFormState = FormState<RecordResult>;

const INSTRUCTOR = ['instructor'] as const;

/** The sentence added when a run was stored but held for review by the run check. */
const heldForReview = (status: string) => (status === 'needs_review' ? ' It needs review before it counts: open it to see why.' : '');

function payloadOf(formData: FormData): unknown {
  const raw = formData.get('payload');
  if (typeof raw !== 'string') return null;
  try {
    return JSON.parse(raw);
  } catch {
    return null;
  }
}

/** Saves the hand-entry grid as one run. */
export const saveManualRunAction = withActionRole(RECORD_ROLES, async (user, form): Promise<RecordFormState> => {
  const { runId, stepCount, status } = await saveManualRun(user, payloadOf(form));
  revalidatePath('/runs');
  revalidatePath('/record');
  return okState(`Saved run ${runId} with ${stepCount} steps.${heldForReview(status)}`, { runId });
});

/** Simulates one run of the header's joint, method and lubricant and saves it (source simulated). */
export const saveSimulatedRunAction = withActionRole(RECORD_ROLES, async (user, form): Promise<RecordFormState> => {
  const { runId, stepCount, status, alreadyStored } = await saveSimulatedRun(user, payloadOf(form));
  if (alreadyStored) return okState(`This simulation (same header, gasket and seed) is already stored as run ${runId}; it was not stored again. Change the seed for another run.`, { runId });
  revalidatePath('/runs');
  return okState(`Simulated and saved run ${runId} with ${stepCount} steps.${heldForReview(status)}`, { runId });
});

/** Creates an empty run in status recording for the bridge. */
export const startRecordingAction = withActionRole(RECORD_ROLES, async (user, form): Promise<RecordFormState> => {
  const { runId } = await startRecording(user, (payloadOf(form) as { header?: unknown } | null)?.header);
  revalidatePath('/record');
  return okState(`Recording run ${runId}. Connect the logger, or start the bridge with --run ${runId}.`, { runId });
});

const runIdSchema = z.object({ runId: z.coerce.number().int().positive() });

/** Finishes a recording: derives the steps and marks the run complete. */
export const finishRecordingAction = withActionRole(RECORD_ROLES, async (user, form): Promise<RecordFormState> => {
  const { runId } = parseFields(runIdSchema, { runId: form.get('runId') }, 'Choose the recording to finish.');
  const { stepCount, status } = await finishRecording(user, runId);
  revalidatePath('/runs');
  revalidatePath('/record');
  return okState(`Run ${runId} is ${status === 'needs_review' ? 'finished' : 'complete'}: ${stepCount} steps derived from the stream.${heldForReview(status)}`, { runId });
});

const tokenSchema = z.object({
  jointId: z.coerce.number({ error: 'Choose a joint.' }).int().positive('Choose a joint.'),
  label: z.string().trim().min(1, 'Name the bridge, e.g. "Bay 2 logger".').max(120, 'Keep the name under 120 characters.'),
});

/** Creates a bridge token for a joint (instructors); the token is shown once. */
export const createStreamTokenAction = withActionRole(INSTRUCTOR, async (user, form): Promise<RecordFormState> => {
  const { jointId, label } = parseFields(tokenSchema, { jointId: form.get('jointId'), label: form.get('label') }, 'The token needs a joint and a name.');
  const { id, token } = await createStreamToken(user, jointId, label);
  revalidatePath('/record');
  return okState('Token created. Copy it now: it is shown only once.', { token: { id, value: token, jointId } });
});

/** Revokes a bridge token this instructor created. */
export const revokeStreamTokenAction = withActionRole(INSTRUCTOR, async (user, form): Promise<RecordFormState> => {
  const { tokenId } = parseFields(z.object({ tokenId: z.coerce.number().int().positive() }), { tokenId: form.get('tokenId') }, 'Choose the token to revoke.');
  await revokeStreamToken(user, tokenId);
  revalidatePath('/record');
  return okState('Token revoked: the bridge using it is now refused.');
});

/** Remembers the way in and the header's choices for the signed-in person (the next visit starts from them). */
export const saveRecordPreferencesAction = withActionRole(RECORD_ROLES, async (user, form): Promise<FormState> => {
  await saveRecordPreferences(user, payloadOf(form));
  return okState('Remembered.');
});

'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { RECORD_ROLES } from '@/lib/data/record';
import { createStreamToken, revokeStreamToken } from '@/lib/data/stream-tokens';
import { isAppError } from '@/lib/http/errors';
import { finishRecording, startRecording } from '@/lib/data/runs/live-stream';
import { saveManualRun } from '@/lib/data/runs/manual-run';
import { saveSimulatedRun } from '@/lib/data/runs/simulated-run';
import type { RecordActionState } from '@/lib/record/action-state';
import { assertRole, getSessionUser } from '@/lib/auth/session';


function failure(error: unknown): RecordActionState {
  if (isAppError(error)) {
    const fieldErrors = (error.details.fieldErrors ?? {}) as Record<string, string[] | undefined>;
    const row = typeof error.details.row === 'number' ? error.details.row : undefined;
    const column = typeof error.details.column === 'string' ? error.details.column : undefined;
    return { ok: false, message: error.message, errors: fieldErrors, ...(row && column ? { cell: { row, column } } : {}) };
  }
  console.error('[record] unexpected error', error);
  return { ok: false, message: 'Something went wrong on our side; nothing was saved. Try again.', errors: {} };
}

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
export async function saveManualRunAction(_prev: RecordActionState, formData: FormData): Promise<RecordActionState> {
  try {
    const user = await getSessionUser();
    assertRole(user, RECORD_ROLES);
    const { runId, stepCount } = await saveManualRun(user, payloadOf(formData));
    revalidatePath('/runs');
    revalidatePath('/record');
    return { ok: true, message: `Saved run ${runId} with ${stepCount} steps.`, errors: {}, runId };
  } catch (error) {
    return failure(error);
  }
}

/** Simulates one run of the header's joint, method and lubricant and saves it (source simulated). */
export async function saveSimulatedRunAction(_prev: RecordActionState, formData: FormData): Promise<RecordActionState> {
  try {
    const user = await getSessionUser();
    assertRole(user, RECORD_ROLES);
    const { runId, stepCount } = await saveSimulatedRun(user, payloadOf(formData));
    revalidatePath('/runs');
    return { ok: true, message: `Simulated and saved run ${runId} with ${stepCount} steps.`, errors: {}, runId };
  } catch (error) {
    return failure(error);
  }
}

/** Creates an empty run in status recording for the bridge. */
export async function startRecordingAction(_prev: RecordActionState, formData: FormData): Promise<RecordActionState> {
  try {
    const user = await getSessionUser();
    assertRole(user, RECORD_ROLES);
    const { runId } = await startRecording(user, (payloadOf(formData) as { header?: unknown } | null)?.header);
    revalidatePath('/record');
    return { ok: true, message: `Recording run ${runId}. Start the bridge with --run ${runId}.`, errors: {}, runId };
  } catch (error) {
    return failure(error);
  }
}

const runIdSchema = z.object({ runId: z.coerce.number().int().positive() });

/** Finishes a recording: derives the steps and marks the run complete. */
export async function finishRecordingAction(_prev: RecordActionState, formData: FormData): Promise<RecordActionState> {
  try {
    const user = await getSessionUser();
    assertRole(user, RECORD_ROLES);
    const parsed = runIdSchema.safeParse({ runId: formData.get('runId') });
    if (!parsed.success) return { ok: false, message: 'Choose the recording to finish.', errors: z.flattenError(parsed.error).fieldErrors };
    const { stepCount } = await finishRecording(user, parsed.data.runId);
    revalidatePath('/runs');
    revalidatePath('/record');
    return { ok: true, message: `Run ${parsed.data.runId} is complete: ${stepCount} steps derived from the stream.`, errors: {}, runId: parsed.data.runId };
  } catch (error) {
    return failure(error);
  }
}

const tokenSchema = z.object({
  jointId: z.coerce.number({ error: 'Choose a joint.' }).int().positive('Choose a joint.'),
  label: z.string().trim().min(1, 'Name the bridge, e.g. "Bay 2 logger".').max(120, 'Keep the name under 120 characters.'),
});

/** Creates a bridge token for a joint (instructors); the token is shown once. */
export async function createStreamTokenAction(_prev: RecordActionState, formData: FormData): Promise<RecordActionState> {
  try {
    const user = await getSessionUser();
    assertRole(user, ['instructor']);
    const parsed = tokenSchema.safeParse({ jointId: formData.get('jointId'), label: formData.get('label') });
    if (!parsed.success) return { ok: false, message: 'The token needs a joint and a name.', errors: z.flattenError(parsed.error).fieldErrors };
    const { id, token } = await createStreamToken(user, parsed.data.jointId, parsed.data.label);
    revalidatePath('/record');
    return { ok: true, message: 'Token created. Copy it now: it is shown only once.', errors: {}, token: { id, value: token, jointId: parsed.data.jointId } };
  } catch (error) {
    return failure(error);
  }
}

/** Revokes a bridge token this instructor created. */
export async function revokeStreamTokenAction(_prev: RecordActionState, formData: FormData): Promise<RecordActionState> {
  try {
    const user = await getSessionUser();
    assertRole(user, ['instructor']);
    const parsed = z.object({ tokenId: z.coerce.number().int().positive() }).safeParse({ tokenId: formData.get('tokenId') });
    if (!parsed.success) return { ok: false, message: 'Choose the token to revoke.', errors: z.flattenError(parsed.error).fieldErrors };
    await revokeStreamToken(user, parsed.data.tokenId);
    revalidatePath('/record');
    return { ok: true, message: 'Token revoked: the bridge using it is now refused.', errors: {} };
  } catch (error) {
    return failure(error);
  }
}

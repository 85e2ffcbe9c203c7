'use server';

import { revalidatePath } from 'next/cache';
import { recordCalibration, saveCalibrationLimits } from '@/lib/data/calibration';
import { correctCalibration, correctionSchema } from '@/lib/data/calibration-correction';
import { JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { okState } from '@/lib/http/form-state';
import { formValues, parseFields, withActionRole } from '@/lib/http/server-action';
import { calibrationSessionSchema } from '@/lib/calibration/session-input';
import { calibrationLimitsSchema } from '@/lib/calibration/calibration-limits';

/** Records a calibration session for the bound joint (one transaction in lib/data/calibration.ts). */
export const recordCalibrationAction = withActionRole(JOINT_LIBRARY_ROLES, async (user, form, jointId: number) => {
  const input = parseFields(calibrationSessionSchema, formValues(form), 'Check the marked fields.');
  const saved = await recordCalibration(user, jointId, input);
  revalidatePath(`/joints/${jointId}/calibration`);
  revalidatePath(`/joints/${jointId}`);
  return okState(saved.accepted ? 'Calibration saved and accepted: the joint now uses the new factors.' : 'Calibration saved but refused: the joint keeps its factors. See the positions below.');
});

/** The centre's acceptance limits (admin). */
export const saveLimitsAction = withActionRole(['admin'], async (user, form, jointId: number) => {
  await saveCalibrationLimits(user, parseFields(calibrationLimitsSchema, formValues(form), 'Check the marked limits.'));
  revalidatePath(`/joints/${jointId}/calibration`);
  return okState('Limits saved; they apply to calibrations recorded from now on.');
});

/** Corrects a session and recomputes the runs measured with it (lib/data/calibration-correction.ts, one transaction). */
export const correctCalibrationAction = withActionRole(JOINT_LIBRARY_ROLES, async (user, form, jointId: number, sessionId: number) => {
  const values = formValues(form);
  const input = parseFields(correctionSchema, values, 'Check the marked fields.');
  const result = await correctCalibration(user, sessionId, input, values.version);
  revalidatePath(`/joints/${jointId}/calibration`);
  const runs = result.changedRunIds.length;
  return okState(`Calibration corrected (${result.accepted ? 'accepted' : 'refused'}); ${runs} run${runs === 1 ? '' : 's'} recomputed.`);
});

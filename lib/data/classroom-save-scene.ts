import 'server-only';
import { isAppError } from '@/lib/http/errors';
import { saveSceneRuns } from '@/lib/data/classroom';
import { assertRole, type SessionUser } from '@/lib/auth/session';
import { saveSceneSchema, type SaveSceneState } from '../classroom/save-scene-input';

/**
 * The work of the classroom's save action apart from Next's own calls (session, revalidatePath),
 * so integration tests can drive it: role first, then zod, then one transaction.
 */
export async function handleSaveScene(user: SessionUser | null, formData: FormData, deps: Parameters<typeof saveSceneRuns>[2] = {}): Promise<SaveSceneState> {
  try {
    assertRole(user, ['instructor']);
    const parsed = saveSceneSchema.safeParse(Object.fromEntries([...formData.entries()].filter(([, v]) => typeof v === 'string')));
    if (!parsed.success) {
      return { status: 'error', code: 'invalid_input', message: 'The runs were not saved: check the fields marked.', errors: parsed.error.flatten().fieldErrors };
    }
    const result = await saveSceneRuns(user, parsed.data, deps);
    return {
      status: 'saved',
      message: `Saved ${result.runIds.length} simulated runs to the cohort.`,
      errors: {},
      compareHref: result.compareHref,
      savedCount: result.runIds.length,
    };
  } catch (error) {
    if (!isAppError(error)) throw error;
    const field = typeof error.details.field === 'string' ? error.details.field : null;
    return { status: 'error', code: error.code, message: error.message, errors: field ? { [field]: [error.message] } : {} };
  }
}

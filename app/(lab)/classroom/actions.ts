'use server';

import { revalidatePath } from 'next/cache';
import { handleSaveScene } from '@/lib/data/classroom-save-scene';
import type { SaveSceneState } from '@/lib/classroom/save-scene-input';
import { getSessionUser } from '@/lib/auth/session';

/** Saves a classroom scene's simulated runs to one of the instructor's cohorts (one transaction). */
export async function saveSceneAction(_previous: SaveSceneState, formData: FormData): Promise<SaveSceneState> {
  const state = await handleSaveScene(await getSessionUser(), formData);
  if (state.status === 'saved') {
    revalidatePath('/runs');
    revalidatePath('/compare');
  }
  return state;
}

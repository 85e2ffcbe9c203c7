'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import type { LibraryFormState } from '@/lib/joints/form-state';
import { handleJointSave, handleLubricantSave, handleMethodSave } from '@/lib/data/library-forms';
import { getSessionUser } from '@/lib/auth/session';

/**
 * Server actions of the joint library. Each checks the role (instructor, admin) through
 * assertRole, validates with zod safeParse, saves in one transaction (lib/data/joints.ts), then
 * revalidates the library pages and returns to the list. Bind the id: `saveJoint.bind(null, id)`.
 */

function afterSave(state: LibraryFormState, kind: 'joint' | 'method' | 'lubricant', path: (id: number) => string): LibraryFormState {
  if (state.status !== 'saved' || state.savedId === undefined) return state;
  revalidatePath('/joints');
  revalidatePath(path(state.savedId));
  redirect(`/joints?saved=${kind}#${kind}s`);
}

export async function saveJointAction(id: number | null, _previous: LibraryFormState, formData: FormData): Promise<LibraryFormState> {
  const state = await handleJointSave(await getSessionUser(), id, formData);
  return afterSave(state, 'joint', (savedId) => `/joints/${savedId}`);
}

export async function saveMethodAction(id: number | null, _previous: LibraryFormState, formData: FormData): Promise<LibraryFormState> {
  const state = await handleMethodSave(await getSessionUser(), id, formData);
  return afterSave(state, 'method', (savedId) => `/joints/methods/${savedId}`);
}

export async function saveLubricantAction(id: number | null, _previous: LibraryFormState, formData: FormData): Promise<LibraryFormState> {
  const state = await handleLubricantSave(await getSessionUser(), id, formData);
  return afterSave(state, 'lubricant', (savedId) => `/joints/lubricants/${savedId}`);
}

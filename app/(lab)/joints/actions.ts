'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { JOINT_LIBRARY_ROLES, saveJoint, saveLubricant, saveMethod } from '@/lib/data/joints';
import type { SessionUser } from '@/lib/auth/session';
import { AppError } from '@/lib/http/errors';
import { formValues, withActionRole } from '@/lib/http/server-action';
import { parseJointForm, type ParseResult } from '@/lib/joints/joint-input';
import { parseLubricantForm, parseMethodForm } from '@/lib/joints/method-input';

/**
 * Server actions of the joint library (instructor, admin): zod checks, one save in one
 * transaction (lib/data/joints.ts), then the library pages are revalidated and the browser goes
 * back to the list. Bind the id (null for a new row): `saveJointAction.bind(null, id)`.
 */

type Kind = 'joint' | 'method' | 'lubricant';
type Save<T> = (user: SessionUser, id: number | null, input: T, version: string | undefined) => Promise<{ id: number }>;

function libraryAction<T>(kind: Kind, parse: (values: Record<string, string>) => ParseResult<T>, save: Save<T>, pathOf: (id: number) => string) {
  return withActionRole(JOINT_LIBRARY_ROLES, async (user, form, id: number | null) => {
    const values = formValues(form);
    const parsed = parse(values);
    if (!parsed.ok) throw new AppError('invalid_input', parsed.message, { fieldErrors: parsed.errors });
    const saved = await save(user, id, parsed.value, values.version);
    revalidatePath('/joints');
    revalidatePath(pathOf(saved.id));
    redirect(`/joints?saved=${kind}#${kind}s`);
  });
}

export const saveJointAction = libraryAction('joint', parseJointForm, saveJoint, (id) => `/joints/${id}`);
export const saveMethodAction = libraryAction('method', parseMethodForm, saveMethod, (id) => `/joints/methods/${id}`);
export const saveLubricantAction = libraryAction('lubricant', parseLubricantForm, saveLubricant, (id) => `/joints/lubricants/${id}`);

import 'server-only';
import { isAppError } from '@/lib/http/errors';
import { saveJoint, saveLubricant, saveMethod } from '@/lib/data/joints';
import { assertRole, type SessionUser } from '@/lib/auth/session';
import { parseJointForm, type ParseResult } from '../joints/joint-input';
import { parseLubricantForm, parseMethodForm } from '../joints/method-input';
import type { LibraryFormState } from '../joints/form-state';

/**
 * The work of the joint-library server actions, apart from Next's own calls (session,
 * revalidatePath, redirect), so integration tests can drive it with any user and FormData:
 * role check first, then zod checks, then one save in one transaction.
 */

const LIBRARY_ROLES = ['instructor', 'admin'] as const;

/** FormData → plain text values (files ignored). */
export function formValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of formData.entries()) if (typeof value === 'string') values[key] = value;
  return values;
}

function refused(error: unknown): LibraryFormState {
  if (!isAppError(error)) throw error;
  const field = typeof error.details.field === 'string' ? error.details.field : null;
  return { status: 'error', code: error.code, message: error.message, errors: field && field !== 'version' ? { [field]: [error.message] } : {} };
}

async function handle<T>(
  user: SessionUser | null,
  formData: FormData,
  parse: (values: Record<string, string>) => ParseResult<T>,
  save: (user: SessionUser, input: T, version: string | undefined) => Promise<{ id: number }>,
): Promise<LibraryFormState> {
  try {
    assertRole(user, LIBRARY_ROLES);
    const values = formValues(formData);
    const parsed = parse(values);
    if (!parsed.ok) return { status: 'error', code: 'invalid_input', message: parsed.message, errors: parsed.errors };
    const { id } = await save(user, parsed.value, values.version);
    return { status: 'saved', message: 'Saved.', errors: {}, savedId: id };
  } catch (error) {
    return refused(error);
  }
}

export const handleJointSave = (user: SessionUser | null, id: number | null, formData: FormData) =>
  handle(user, formData, parseJointForm, (u, input, version) => saveJoint(u, id, input, version));

export const handleMethodSave = (user: SessionUser | null, id: number | null, formData: FormData) =>
  handle(user, formData, parseMethodForm, (u, input, version) => saveMethod(u, id, input, version));

export const handleLubricantSave = (user: SessionUser | null, id: number | null, formData: FormData) =>
  handle(user, formData, parseLubricantForm, (u, input, version) => saveLubricant(u, id, input, version));

import { ConnectionAcquireTimeoutError, ConnectionRefusedError, HostNotReachableError } from 'sequelize';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import { FORM_DATABASE_DOWN_MESSAGE, FORM_INTERNAL_MESSAGE, FORM_INVALID_MESSAGE, formStateFromError } from '@/lib/http/form-error';

// Expected values are the rules written in lib/http/form-error.ts and DEVELOPERS.md ("Errors").
afterEach(() => vi.restoreAllMocks());

describe('formStateFromError', () => {
  it('shows an AppError with its message and code and marks its per-field messages', () => {
    const error = new AppError('invalid_input', 'The cohort was not created; correct the fields marked.', { fieldErrors: { name: ['Enter a name.'] } });
    expect(formStateFromError(error)).toEqual({ status: 'error', code: 'invalid_input', message: 'The cohort was not created; correct the fields marked.', fieldErrors: { name: ['Enter a name.'] } });
  });

  it('marks the field an AppError names when it carries no per-field messages', () => {
    const error = new AppError('not_found', 'That cohort does not exist or is not yours.', { field: 'cohortId' });
    expect(formStateFromError(error)).toEqual({ status: 'error', code: 'not_found', message: 'That cohort does not exist or is not yours.', fieldErrors: { cohortId: ['That cohort does not exist or is not yours.'] } });
  });

  it('does not mark the hidden version field of a stale edit, and marks nothing for an AppError without a field', () => {
    expect(formStateFromError(new AppError('conflict', 'Changed by someone else.', { field: 'version' }))).toEqual({ status: 'error', code: 'conflict', message: 'Changed by someone else.' });
    expect(formStateFromError(new AppError('forbidden', 'Your role does not allow this.'))).toEqual({ status: 'error', code: 'forbidden', message: 'Your role does not allow this.' });
  });

  it('carries the grid cell of an AppError that names a row and a column', () => {
    const state = formStateFromError(new AppError('invalid_input', 'Row 3, Stud 2 is not a number.', { row: 3, column: 'Stud 2' }));
    expect(state.cell).toEqual({ row: 3, column: 'Stud 2' });
    expect(formStateFromError(new AppError('invalid_input', 'Enter the loads.', { row: 1 })).cell).toBeUndefined();
  });

  it('turns a ZodError into invalid_input with zod’s per-field messages', () => {
    const parsed = z.object({ seed: z.number({ error: 'The seed must be a whole number.' }) }).safeParse({ seed: 'x' });
    expect(parsed.success).toBe(false);
    expect(formStateFromError(parsed.error)).toEqual({ status: 'error', code: 'invalid_input', message: FORM_INVALID_MESSAGE, fieldErrors: { seed: ['The seed must be a whole number.'] } });
  });

  it.each([
    ['a refused connection', new ConnectionRefusedError(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3307'), { code: 'ECONNREFUSED' }))],
    ['a pool that gives no connection in time', new ConnectionAcquireTimeoutError(new Error('Operation timeout'))],
    ['an unreachable host', new HostNotReachableError(new Error('EHOSTUNREACH'))],
  ])('says the database is not answering for %s (Sequelize connection errors)', (_kind, error) => {
    expect(formStateFromError(error)).toEqual({ status: 'error', code: 'unavailable', message: FORM_DATABASE_DOWN_MESSAGE });
    expect(FORM_DATABASE_DOWN_MESSAGE).toMatch(/database is not answering/);
  });

  it('gives anything else a generic message and sends the details to the server log only', () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => {});
    const error = new Error('ER_DUP_ENTRY: secret table detail');
    const state = formStateFromError(error);
    expect(state).toEqual({ status: 'error', code: 'internal', message: FORM_INTERNAL_MESSAGE });
    expect(state.message).not.toContain('secret');
    expect(log).toHaveBeenCalledWith('[action] unexpected error', error);
  });
});

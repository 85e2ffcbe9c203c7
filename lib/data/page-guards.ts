import 'server-only';
import { notFound } from 'next/navigation';
import { isAppError } from '../http/errors';

/** Runs a page's read; a not-found or not-yours AppError shows the segment's not-found page. */
export async function orNotFound<T>(read: () => Promise<T>): Promise<T> {
  try {
    return await read();
  } catch (error) {
    if (isAppError(error) && (error.code === 'not_found' || error.code === 'forbidden')) notFound();
    throw error;
  }
}

import path from 'node:path';

/**
 * Path to a file in the shared reference folder, resolved relative to the repository so that CI,
 * which clones the repo with shared/ beside it, finds the same files: <repo>/../shared/reference/...
 */
export function referencePath(...parts: string[]): string {
  return path.resolve(__dirname, '../../../../shared/reference', ...parts);
}

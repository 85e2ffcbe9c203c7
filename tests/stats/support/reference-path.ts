import path from 'node:path';

/**
 * Path to a file in the repository's reference data (tests/fixtures/reference, provenance and
 * checksums in its README.md). The files live in the repository, so a fresh clone has them.
 */
export function referencePath(...parts: string[]): string {
  return path.resolve(__dirname, '../../fixtures/reference', ...parts);
}

import packageJson from '@/package.json';

/** The software that computed a result: the package version and, when the build knew it, the git commit. */
export function softwareVersion(): string {
  const commit = process.env.EVENLOAD_BUILD_COMMIT ?? '';
  return commit ? `evenload ${packageJson.version} (${commit.slice(0, 12)})` : `evenload ${packageJson.version}`;
}

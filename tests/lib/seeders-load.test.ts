import { execFileSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// The seeders run under tsx (scripts/migrate.ts seed), outside Next.js, where a module marked
// `import 'server-only'` throws on load. Vitest stubs that marker, so only a real tsx import shows
// it: a seeder that reaches such a module fails `npm start` and `npm test` on a fresh clone.
const root = path.resolve(__dirname, '../..');
const seeders = readdirSync(path.join(root, 'seeders')).filter((name) => name.endsWith('.ts'));

describe('seeders load under tsx', () => {
  it('finds the seeders', () => {
    expect(seeders.length).toBeGreaterThan(0);
  });
  for (const name of seeders) {
    it(`${name} imports without a server-only module on its path`, () => {
      const file = path.join(root, 'seeders', name);
      const script = `await import(${JSON.stringify(file)}); console.log('loaded');`;
      const output = execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['--input-type=module', '-e', script], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
      expect(output.trim()).toBe('loaded');
    }, 60_000);
  }
});

import { describe, expect, it } from 'vitest';
import { etagMatches } from '@/lib/http/etag';

// Expected values: RFC 9110 §13.1.2 (If-None-Match: weak comparison, a list of tags or "*") and the
// weak-comparison table of §8.8.3.2 (W/"1" and "1" match weakly; "1" and "2" do not).
describe('etagMatches (If-None-Match)', () => {
  it('matches the same tag, strong or weak, and "*"', () => {
    expect(etagMatches('"1"', '"1"')).toBe(true);
    expect(etagMatches('W/"1"', '"1"')).toBe(true);
    expect(etagMatches('"1"', 'W/"1"')).toBe(true);
    expect(etagMatches('*', '"1"')).toBe(true);
  });

  it('finds the tag in a list and refuses a different one or no header', () => {
    expect(etagMatches('"xyzzy", "r2d2xxxx", "c3piozzzz"', '"r2d2xxxx"')).toBe(true);
    expect(etagMatches('"1"', '"2"')).toBe(false);
    expect(etagMatches('"xyzzy", "r2d2xxxx"', '"c3piozzzz"')).toBe(false);
    expect(etagMatches(null, '"1"')).toBe(false);
    expect(etagMatches('', '"1"')).toBe(false);
  });
});

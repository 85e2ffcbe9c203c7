/**
 * True when an If-None-Match header names this ETag or is `*` (RFC 9110 §13.1.2: If-None-Match uses
 * the weak comparison of §8.8.3.2, so `W/"x"` and `"x"` match).
 */
export function etagMatches(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  const opaque = etag.replace(/^W\//, '');
  return ifNoneMatch.split(',').some((tag) => {
    const trimmed = tag.trim();
    return trimmed === '*' || trimmed.replace(/^W\//, '') === opaque;
  });
}

import 'server-only';
import { freshReads } from '../platform/fresh-read';
import { replicaReadState } from '../platform/replica-routing';
import { readRowArrays } from './read-row-arrays';

/**
 * The runs list's answers, remembered per instance and checked against MariaDB on every request.
 * `run_list_versions` (migration 20261205190000) is raised by triggers in the same transaction as
 * every change that can alter a page of the list, on whichever instance (or script) makes it. A page
 * is computed in one statement that also reads that stamp, so the stamp names exactly the data the
 * page was built from; a later request reads the stamp alone (one row of 16 sums, on the same read
 * target the list itself would use) and gets the remembered JSON only while the stamp is unchanged.
 * So a request after any committed write sees it (read-your-writes holds as for the list's own
 * query), and nothing is served longer than until the next write. Entries are keyed by the person
 * (id and role), their scope and the whole query, so one person's page is never served to another.
 */

/** The stamp as SQL, for a column of the statement that reads the page. */
export const RUN_LIST_VERSION_SQL = '(SELECT CAST(SUM(v.version) AS CHAR) FROM run_list_versions v)';

async function readStamp(): Promise<string> {
  const [row] = await readRowArrays<[version: string | null]>(`SELECT ${RUN_LIST_VERSION_SQL} AS version`);
  return String(row?.[0] ?? '');
}

/** Requests that arrive together share one stamp read begun after each of them arrived (`freshReads`). */
const sharedStamp = freshReads(readStamp);

/**
 * The stamp now, as text (a sum of BIGINT counters). Without replicas every read goes to the
 * primary, so concurrent requests share reads; with replicas each request reads on the target its
 * own cookies choose (read-your-writes after its person's write).
 */
export async function runListVersion(): Promise<string> {
  return replicaReadState() === 'none' ? sharedStamp() : readStamp();
}

/** At most this many answers per instance (the oldest dropped first): about 12 kB each at 25 rows. */
const MEMO_LIMIT = 2000;
const memo = new Map<string, { version: string; json: string }>();

/** The remembered JSON for this key when it was built at the stamp MariaDB holds now; else null. */
export async function rememberedRunList(key: string): Promise<string | null> {
  const known = memo.get(key);
  if (!known) return null;
  return known.version === (await runListVersion()) ? known.json : null;
}

/** Keeps a page's JSON with the stamp read in the same statement as its rows. */
export function rememberRunList(key: string, version: string, json: string): void {
  memo.delete(key);
  memo.set(key, { version, json });
  while (memo.size > MEMO_LIMIT) memo.delete(memo.keys().next().value as string);
}

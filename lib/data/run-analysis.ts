import 'server-only';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/models';
import { analyseRun } from '../analysis/analyse-run';
import { AppError } from '../http/errors';
import { etagMatches } from '../http/etag';
import type { SessionUser } from '../auth/session';
import { loadRun } from './run-report';
import { runScopeSql } from './scope';
import { analysisEtag, storeRunAnalysis } from './runs/stored-analysis';

/**
 * The analysis of a run the viewer may see, for GET /api/runs/:id/analysis: its ETag, and its JSON
 * unless the client's If-None-Match already names that ETag (then `bodyJson` is null: answer 304).
 * Read from `run_analyses` in one query on the run's scope; a run without a stored analysis (one
 * stored before analyses were kept) is analysed now and kept.
 */
export async function runAnalysisFor(user: SessionUser, runId: number, ifNoneMatch: string | null): Promise<{ etag: string; bodyJson: string | null }> {
  const scope = await runScopeSql(user);
  const withBody = ifNoneMatch === null;
  const [row] = await sequelize.query<{ etag: string | null; body_json?: string | null }>(
    `SELECT a.etag${withBody ? ', a.body_json' : ''} FROM runs r LEFT JOIN run_analyses a ON a.run_id = r.id WHERE r.id = ? AND ${scope.sql}`,
    { type: QueryTypes.SELECT, replacements: [runId, ...scope.params] },
  );
  if (!row) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
  if (row.etag !== null) {
    if (etagMatches(ifNoneMatch, row.etag)) return { etag: row.etag, bodyJson: null };
    if (row.body_json) return { etag: row.etag, bodyJson: row.body_json };
    const [stored] = await sequelize.query<{ body_json: string }>('SELECT body_json FROM run_analyses WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    if (stored) return { etag: row.etag, bodyJson: stored.body_json };
  }
  const { header, run } = await loadRun(user, runId);
  const kept = await storeRunAnalysis(runId, run);
  if (kept) return etagMatches(ifNoneMatch, kept.etag) ? { etag: kept.etag, bodyJson: null } : kept;
  // Too large to keep: analysed on every request (the header and readings come from loadRun).
  const bodyJson = JSON.stringify(analyseRun(runId, run, { bandPercent: header.bandPercent, passPercents: header.method.passPercents }));
  const etag = analysisEtag(bodyJson);
  return etagMatches(ifNoneMatch, etag) ? { etag, bodyJson: null } : { etag, bodyJson };
}

import { createHash } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { analyseRun } from '../../analysis/analyse-run';
import { passPercentsOf } from '../../analysis/pass-percents-of';
import type { NormalisedRun } from '../../record/run-types';
import type { MethodPass } from '@/models/method';
import { sequelize } from '../../../models';

/**
 * A run's analysis (the body of GET /api/runs/:id/analysis) is computed when the run is stored or
 * its readings change (storeRun, refreshRunFigures) and kept in `run_analyses` with its ETag, in
 * the caller's transaction. Runs above {@link STORED_ANALYSIS_MAX_READINGS} readings are not kept
 * (their analysis would outgrow a row and the request's packet); they are analysed on request.
 * No `server-only` here: storeRun runs in scripts (bench, seed) too.
 */
export const STORED_ANALYSIS_MAX_READINGS = 250_000;

export interface StoredAnalysis {
  etag: string;
  bodyJson: string;
}

/** The strong ETag of an analysis body (a hash of its JSON). */
export const analysisEtag = (bodyJson: string) => `"${createHash('sha256').update(bodyJson).digest('base64url').slice(0, 32)}"`;

/** Computes the run's analysis and stores it (or removes a stale one); null when the run is not kept. */
export async function storeRunAnalysis(runId: number, run: NormalisedRun, transaction?: Transaction): Promise<StoredAnalysis | null> {
  if (run.steps.length === 0 || run.steps.length * run.studCount > STORED_ANALYSIS_MAX_READINGS) {
    await sequelize.query('DELETE FROM run_analyses WHERE run_id = ?', { replacements: [runId], transaction });
    return null;
  }
  const [row] = await sequelize.query<{ band_percent: number; passes: string | MethodPass[]; check_passes: number }>(
    'SELECT r.band_percent, m.passes, m.check_passes FROM runs r JOIN methods m ON m.id = r.method_id WHERE r.id = ?',
    { type: QueryTypes.SELECT, replacements: [runId], transaction },
  );
  if (!row) return null;
  const passes = typeof row.passes === 'string' ? (JSON.parse(row.passes) as MethodPass[]) : row.passes;
  const passPercents = passPercentsOf({ passes, checkPasses: Number(row.check_passes) });
  const bodyJson = JSON.stringify(analyseRun(runId, run, { bandPercent: Number(row.band_percent), passPercents }));
  const etag = analysisEtag(bodyJson);
  await sequelize.query(
    `INSERT INTO run_analyses (run_id, etag, body_json, updated_at) VALUES (?, ?, ?, NOW())
     ON DUPLICATE KEY UPDATE etag = VALUES(etag), body_json = VALUES(body_json), updated_at = VALUES(updated_at)`,
    { replacements: [runId, etag, bodyJson], transaction },
  );
  return { etag, bodyJson };
}

/** Drops the stored analyses of a method's runs (its passes may have changed); they are recomputed on request. */
export async function forgetMethodAnalyses(methodId: number, transaction?: Transaction): Promise<void> {
  await sequelize.query('DELETE a FROM run_analyses a JOIN runs r ON r.id = a.run_id WHERE r.method_id = ?', { replacements: [methodId], transaction });
}

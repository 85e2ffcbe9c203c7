import 'server-only';
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { z } from 'zod';
import { Cohort, Joint, Lubricant, Method, Run, sequelize } from '@/models';
import { csvRows } from '../export/write-csv';
import { csvLoad } from '../export/load-resolution';
import { pseudonymFor } from './pseudonym';
import { assertRole, type SessionUser } from '../auth/session';
import { isoDateSchema } from '../validation/iso-date';

const id = z.coerce.number().int().positive();
const isoDate = isoDateSchema();

export const runExportQuerySchema = z
  .object({
    key: z.string().trim().min(8, 'must be at least 8 characters: it keeps pseudonyms stable across your exports').max(200),
    cohortId: id.optional(),
    methodId: id.optional(),
    lubricantId: id.optional(),
    jointId: id.optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
  })
  .strict();

export type RunExportQuery = z.infer<typeof runExportQuerySchema>;

export const RUN_EXPORT_HEADER = ['run_id', 'recorded_at', 'joint', 'method', 'lubricant', 'cohort', 'operator', 'step', 'pass', 'tightened_position', 'position', 'load_n'];

const RUNS_PER_BATCH = 25;

/**
 * A pseudonymised export of complete runs, one line per reading. Operators appear only as
 * pseudonyms keyed by the export key (the same key gives the same pseudonyms); no names or
 * e-mail addresses. Set-aside runs are left out, as they are from statistics. Researchers and admins.
 */
export async function* exportRunsCsv(user: SessionUser | null, query: RunExportQuery): AsyncGenerator<string> {
  assertRole(user, ['researcher', 'admin']);
  const filters: WhereOptions[] = [{ status: 'complete' }];
  for (const key of ['cohortId', 'methodId', 'lubricantId', 'jointId'] as const) {
    if (query[key] !== undefined) filters.push({ [key]: query[key] });
  }
  if (query.from) filters.push({ recordedAt: { [Op.gte]: new Date(`${query.from}T00:00:00Z`) } });
  if (query.to) filters.push({ recordedAt: { [Op.lt]: new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000) } });
  const runs = await Run.findAll({ where: { [Op.and]: filters }, attributes: ['id', 'recordedAt', 'jointId', 'methodId', 'lubricantId', 'cohortId', 'operatorId'], order: [['recordedAt', 'ASC'], ['id', 'ASC']] });
  const [joints, methods, lubricants, cohorts] = await Promise.all([
    Joint.findAll({ attributes: ['id', 'name'] }),
    Method.findAll({ attributes: ['id', 'name'] }),
    Lubricant.findAll({ attributes: ['id', 'name'] }),
    Cohort.findAll({ attributes: ['id', 'name'] }),
  ]);
  const nameOf = (rows: { id: number; name: string }[], rowId: number | null) => rows.find((r) => r.id === rowId)?.name ?? '';
  const pseudonyms = new Map<number, string>();
  const pseudonym = (userId: number) => {
    if (!pseudonyms.has(userId)) pseudonyms.set(userId, pseudonymFor(userId, `export:${query.key}`));
    return pseudonyms.get(userId)!;
  };
  yield csvRows([RUN_EXPORT_HEADER]);
  for (let start = 0; start < runs.length; start += RUNS_PER_BATCH) {
    const batch = runs.slice(start, start + RUNS_PER_BATCH);
    const readings = await sequelize.query<{ run_id: number; step_order: number; pass_number: number; tightened: number; position: number; load_n: number }>(
      `SELECT s.run_id, s.step_order, s.pass_number, s.position AS tightened, r.position, r.load_n
         FROM tightening_steps s JOIN readings r ON r.step_id = s.id
        WHERE s.run_id IN (?) ORDER BY s.run_id, s.step_order, r.position`,
      { type: QueryTypes.SELECT, replacements: [batch.map((r) => r.id)] },
    );
    yield csvRows(readings.map((reading) => {
      const run = batch.find((r) => r.id === Number(reading.run_id))!;
      return [
        run.id, run.recordedAt.toISOString(), nameOf(joints, run.jointId), nameOf(methods, run.methodId), nameOf(lubricants, run.lubricantId),
        nameOf(cohorts, run.cohortId), pseudonym(run.operatorId), Number(reading.step_order), Number(reading.pass_number), Number(reading.tightened),
        Number(reading.position), csvLoad(Number(reading.load_n), 'si'),
      ];
    }));
  }
}

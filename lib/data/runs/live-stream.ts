import 'server-only';
/**
 * Live stream of a run. A bridge next to the logger posts readings `{ t, stud, load }` (seconds,
 * position, newtons) as newline-delimited JSON; each line is one reading or an array of them.
 *
 * Design (stateless, any app instance may take any batch): raw readings go to `stream_samples`,
 * keyed by (run, time, position), so a retried batch changes nothing and batches may arrive out of
 * order. The steps are derived when the run is finished, from the whole time series sorted by
 * time, with lib/ingest `createStepDeriver` (the same rule as a wide file without a step marker):
 * the series is pivoted by time stamp, a stud missing at a time stamp carries its last value forward,
 * and a stud not yet reported counts as 0 N. The raw samples are kept with the run.
 */
import { Op, QueryTypes } from 'sequelize';
import { STREAM_NEGATIVE_FLOOR_SHARE, streamReadingSchema, type StreamReading } from '@/lib/record/stream-reading';
import { AppError } from '@/lib/http/errors';
import { createStepDeriver } from '@/lib/ingest/derive-steps';
import { jointDto, resolveRunHeader } from '@/lib/data/record';
import { jointForImport } from '@/lib/record/joint-import';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { LoggerLineFormat } from '@/lib/ingest/logger-line';
import { maxBelievableStudLoad } from '@/lib/joints/joint-properties';
import { runScope } from '@/lib/data/scope';
import { STREAM_MAX_READINGS } from '@/lib/record/limits';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { SessionUser } from '@/lib/auth/session';
import { Joint, JointPosition, Run, sequelize } from '@/models';
import { appendSteps, completeRecordedRun, storeRun } from './store-run';
import { formatDecimals } from '@/lib/calc/units';

/** Creates an empty run in status "recording" (source live) for the bridge to stream into. */
export async function startRecording(user: SessionUser, headerInput: unknown): Promise<{ runId: number }> {
  const resolved = await resolveRunHeader(user, headerInput, 'live', 'recording');
  const runId = await sequelize.transaction((transaction) =>
    storeRun(resolved.header, { studCount: resolved.joint.studCount, targetLoadN: resolved.joint.targetLoadN, steps: [] }, transaction),
  );
  return { runId };
}


/**
 * Stores one batch from the bridge. The token's joint must be the run's joint and the run must be
 * recording.
 *
 * @throws AppError: 'not_found' (no such run, or another joint's run), 'conflict' (not recording),
 *   'invalid_input' naming the line and field of the first bad reading.
 */
export async function appendStreamReadings(jointId: number, runId: number, body: string): Promise<{ accepted: number; total: number }> {
  const run = await Run.findByPk(runId, { attributes: ['id', 'jointId', 'status', 'studCount', 'targetLoadN'] });
  if (!run || run.jointId !== jointId) throw new AppError('not_found', `Run ${runId} does not exist or is not on this token's joint.`);
  if (run.status !== 'recording') throw new AppError('conflict', `Run ${runId} is ${run.status === 'set_aside' ? 'set aside' : run.status}, not recording; start a new recording on the Record page.`);
  const joint = await Joint.findByPk(jointId);
  const { maxStudLoadN, source } = maxBelievableStudLoad(joint!);
  const floorN = -STREAM_NEGATIVE_FLOOR_SHARE * run.targetLoadN;
  const readings: StreamReading[] = [];
  const lines = body.split(/\r?\n/);
  for (const [index, raw] of lines.entries()) {
    const line = index + 1;
    if (raw.trim() === '') continue;
    let value: unknown;
    try {
      value = JSON.parse(raw);
    } catch {
      throw new AppError('invalid_input', `Line ${line}: not valid JSON. Send one reading {"t": seconds, "stud": position, "load": newtons} or an array of them per line.`, { row: line });
    }
    for (const item of Array.isArray(value) ? value : [value]) {
      const r = streamReadingSchema.safeParse(item);
      if (!r.success) {
        const issue = r.error.issues[0];
        const field = String(issue?.path[0] ?? 'reading');
        throw new AppError('invalid_input', `Line ${line}, field "${field}": ${issue?.message ?? 'not valid'}. Each reading is {"t": seconds ≥ 0, "stud": position, "load": newtons}.`, { row: line, column: field });
      }
      const { t, stud, load } = r.data;
      if (stud > run.studCount) throw new AppError('invalid_input', `Line ${line}, field "stud": position ${stud} is not on this joint (studs 1 to ${run.studCount}).`, { row: line, column: 'stud' });
      if (load < floorN) throw new AppError('invalid_input', `Line ${line}, field "load": ${load} N is negative beyond gauge noise (5 % of target). Check the bridge's zero and unit (newtons).`, { row: line, column: 'load' });
      if (load > maxStudLoadN) throw new AppError('invalid_input', `Line ${line}, field "load": ${load} N is above the limit of ${formatDecimals(maxStudLoadN / 1000, 2, 0)} kN (${source}). The bridge sends newtons: check the unit.`, { row: line, column: 'load' });
      readings.push(r.data);
      if (readings.length > STREAM_MAX_READINGS) throw new AppError('too_large', `At most ${STREAM_MAX_READINGS} readings per request; send smaller batches.`);
    }
  }
  if (readings.length) {
    const now = new Date();
    await sequelize.transaction(async (transaction) => {
      for (let start = 0; start < readings.length; start += 5000) {
        const chunk = readings.slice(start, start + 5000);
        const placeholders = chunk.map(() => '(?,?,?,?,?)').join(',');
        await sequelize.query(`INSERT INTO stream_samples (run_id, time_s, position, load_n, received_at) VALUES ${placeholders} ON DUPLICATE KEY UPDATE load_n = VALUES(load_n)`, {
          transaction,
          replacements: chunk.flatMap((r) => [runId, r.t, r.stud, r.load, now]),
        });
      }
    });
  }
  const [count] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM stream_samples WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
  return { accepted: readings.length, total: Number(count?.n ?? 0) };
}

/**
 * Stores one batch sent by a signed-in person's browser (the Record page's "Connect logger"): the
 * run must be one this person sees; then as {@link appendStreamReadings} on the run's own joint.
 */
export async function appendStreamReadingsAsUser(user: SessionUser, runId: number, body: string): Promise<{ accepted: number; total: number }> {
  const run = await visibleRun(user, runId);
  return appendStreamReadings(run.jointId, runId, body);
}

async function visibleRun(user: SessionUser, runId: number): Promise<Run> {
  // From the primary: the bridge that writes the samples and finishes the run sends no cookie, so the
  // page polling this run would otherwise read a lagging replica's older status.
  const run = await Run.findOne({ where: { [Op.and]: [await runScope(user), { id: runId }] }, useMaster: true });
  if (!run) throw new AppError('not_found', `Run ${runId} does not exist or is not yours to see.`);
  return run;
}

export interface StreamStatus {
  runId: number;
  status: string;
  studCount: number;
  targetLoadN: number;
  /** The run's acceptance band, ± % of target. */
  bandPercent: number;
  sampleCount: number;
  stepCount: number;
  lastTimeS: number | null;
  /** The latest load of every stud reported so far. */
  latest: Array<{ position: number; loadN: number; timeS: number }>;
  /** The most recent readings, newest first. */
  recent: Array<{ timeS: number; position: number; loadN: number }>;
}

/** What has arrived so far, for the page's polling. */
export async function streamStatus(user: SessionUser, runId: number): Promise<StreamStatus> {
  const run = await visibleRun(user, runId);
  const [count, latest, recent] = await Promise.all([
    sequelize.query<{ n: number; last: number | null }>('SELECT COUNT(*) AS n, MAX(time_s) AS last FROM stream_samples WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId], useMaster: true }),
    sequelize.query<{ position: number; load_n: number; time_s: number }>(
      `SELECT s.position, s.load_n, s.time_s FROM stream_samples s
       JOIN (SELECT position, MAX(time_s) AS t FROM stream_samples WHERE run_id = ? GROUP BY position) m ON m.position = s.position AND m.t = s.time_s
       WHERE s.run_id = ? ORDER BY s.position`,
      { type: QueryTypes.SELECT, replacements: [runId, runId], useMaster: true },
    ),
    sequelize.query<{ position: number; load_n: number; time_s: number }>('SELECT position, load_n, time_s FROM stream_samples WHERE run_id = ? ORDER BY time_s DESC, position DESC LIMIT 12', {
      type: QueryTypes.SELECT,
      replacements: [runId],
      useMaster: true,
    }),
  ]);
  return {
    runId,
    status: run.status,
    studCount: run.studCount,
    targetLoadN: run.targetLoadN,
    bandPercent: run.bandPercent,
    sampleCount: Number(count[0]?.n ?? 0),
    stepCount: run.stepCount,
    lastTimeS: count[0]?.last == null ? null : Number(count[0].last),
    latest: latest.map((r) => ({ position: Number(r.position), loadN: Number(r.load_n), timeS: Number(r.time_s) })),
    recent: recent.map((r) => ({ position: Number(r.position), loadN: Number(r.load_n), timeS: Number(r.time_s) })),
  };
}

/**
 * Finishes a recording: derives the steps from every sample, stores them with their readings,
 * recomputes the run's figures and sets the status to complete (or needs review when the run check
 * fails), in one transaction. The operator
 * or an instructor who sees the run may finish it; researchers only their own.
 *
 * @throws AppError('conflict') when the run is not recording; AppError('invalid_input') when no step can be found.
 */
export async function finishRecording(user: SessionUser, runId: number): Promise<{ runId: number; stepCount: number; status: 'complete' | 'needs_review' }> {
  const visible = await visibleRun(user, runId);
  if (user.role === 'researcher' && visible.operatorId !== user.id) throw new AppError('not_found', `Run ${runId} is not yours to finish.`);
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ status: string; stud_count: number; target_load_n: number; joint_id: number; method_id: number; band_percent: number }>(
      'SELECT status, stud_count, target_load_n, joint_id, method_id, band_percent FROM runs WHERE id = ? FOR UPDATE', {
      type: QueryTypes.SELECT,
      transaction,
      replacements: [runId],
    });
    if (!row || row.status !== 'recording') throw new AppError('conflict', `Run ${runId} is not recording (it is ${row?.status ?? 'gone'}).`);
    const studCount = Number(row.stud_count);
    const targetLoadN = Number(row.target_load_n);
    const samples = await sequelize.query<{ time_s: number; position: number; load_n: number }>('SELECT time_s, position, load_n FROM stream_samples WHERE run_id = ? ORDER BY time_s, position', {
      type: QueryTypes.SELECT,
      transaction,
      replacements: [runId],
    });
    if (!samples.length) throw new AppError('invalid_input', 'No readings have arrived for this run yet. Start the bridge, then finish.');
    const deriver = createStepDeriver(studCount, { targetLoadN });
    const loads = new Float64Array(studCount);
    let snapshot = 0;
    for (let i = 0; i < samples.length; ) {
      const t = Number(samples[i]!.time_s);
      while (i < samples.length && Number(samples[i]!.time_s) === t) {
        loads[Number(samples[i]!.position) - 1] = Number(samples[i]!.load_n);
        i++;
      }
      deriver.push({ line: ++snapshot, timeS: t, loadsN: loads });
    }
    const derived = deriver.finish();
    if (!derived.steps.length) {
      throw new AppError('invalid_input', `No tightening step was found in the ${samples.length} readings (no stud rose by more than 2 % of the target while the others held). Check the bridge sends newtons, then finish again.`);
    }
    const run: NormalisedRun = {
      studCount,
      targetLoadN,
      steps: derived.steps.map((s) => ({ order: s.order, pass: s.pass, position: s.position, timeS: s.timeS, loadsN: s.loadsN, covers: s.covers ?? null })),
    };
    await appendSteps(runId, run, 0, transaction);
    const status = await completeRecordedRun(runId, { jointId: Number(row.joint_id), methodId: Number(row.method_id), bandPercent: Number(row.band_percent) }, run, transaction);
    return { runId, stepCount: run.steps.length, status };
  });
}

/** What the bridge needs to read lines in a token's joint's own layout and units (`lib/ingest/logger-line.ts`). */
export async function bridgeLineFormat(jointId: number): Promise<{ jointName: string; format: LoggerLineFormat; joint: JointForImport }> {
  const [joint, positions] = await Promise.all([Joint.findByPk(jointId), JointPosition.findAll({ where: { jointId } })]);
  if (!joint) throw new AppError('not_found', 'The joint of this bridge token no longer exists.');
  const dto = jointDto(joint, positions);
  return { jointName: dto.name, format: dto.loggerLine, joint: jointForImport(dto) };
}

/** Runs in status recording this person may see (for the Stream live section). */
export async function recordingRuns(user: SessionUser): Promise<Array<{ id: number; jointId: number; recordedAt: string }>> {
  const runs = await Run.findAll({ where: { [Op.and]: [await runScope(user), { status: 'recording' }] }, attributes: ['id', 'jointId', 'recordedAt'], order: [['id', 'DESC']], limit: 20 });
  return runs.map((r) => ({ id: r.id, jointId: r.jointId, recordedAt: r.recordedAt.toISOString() }));
}

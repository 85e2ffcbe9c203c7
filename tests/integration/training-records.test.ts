import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { createCohort } from '@/lib/data/cohorts';
import { decideCourseOutcome, setRecordValidity } from '@/lib/data/qualification/course-outcomes';
import { issueTrainingRecord, reissueTrainingRecord, revokeTrainingRecord, trainingRecordPdf } from '@/lib/data/qualification/training-records';
import { VERIFY_LIMIT, verifyKey, verifyTrainingRecord } from '@/lib/data/qualification/verify-record';
import type { SessionUser } from '@/lib/auth/session';
import { count, demoPeople } from './support';

// Issue 17, item 4: records of training for a pass, their PDF read back with Debian's poppler-utils, the public check.
const stamp = Date.now().toString(36);
const courseName = `Flange assembly ${stamp}`;
let instructor: SessionUser;
let otherInstructor: SessionUser;
let trainee: SessionUser;
let cohortId: number;
const dir = mkdtempSync(join(tmpdir(), 'evenload-record-'));
const address = `203.0.113.${Math.floor(Math.random() * 200) + 1}`; // TEST-NET-3 (RFC 5737): never a real client

const pdfText = (bytes: Uint8Array, name: string) => {
  const file = join(dir, name);
  writeFileSync(file, bytes);
  return { text: execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }), info: execFileSync('pdfinfo', [file], { encoding: 'utf8' }), fonts: execFileSync('pdffonts', [file], { encoding: 'utf8' }) };
};

beforeAll(async () => {
  ({ instructor, otherInstructor, trainee } = await demoPeople());
  cohortId = await createCohort(instructor, { name: courseName, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
  await sequelize.query('INSERT INTO cohort_members (cohort_id, user_id, created_at) VALUES (?, ?, NOW())', { replacements: [cohortId, trainee.id] });
});

afterAll(async () => {
  await sequelize.query("DELETE FROM audit_log WHERE (object_type = 'training_record' AND object_id IN (SELECT id FROM training_records WHERE cohort_id = ?)) OR (object_type = 'course_outcome' AND object_id IN (SELECT id FROM course_outcomes WHERE cohort_id = ?)) OR (object_type = 'criteria' AND object_id = ?)", { replacements: [cohortId, cohortId, cohortId] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM sign_in_attempts WHERE attempt_key = ?', { replacements: [verifyKey(address)] });
  await sequelize.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('records of training', () => {
  it('are refused until the course outcome is a pass, and the refusal writes nothing', async () => {
    await expect(issueTrainingRecord(instructor, cohortId, trainee.id)).rejects.toMatchObject({ code: 'invalid_input', message: expect.stringContaining('pass') });
    await decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'not_yet', scopes: [] }, 0);
    await expect(issueTrainingRecord(instructor, cohortId, trainee.id)).rejects.toMatchObject({ code: 'invalid_input' });
    expect(await count('SELECT COUNT(*) AS n FROM training_records WHERE cohort_id = ?', [cohortId])).toBe(0);
    await expect(decideCourseOutcome(otherInstructor, cohortId, trainee.id, { decision: 'pass', scopes: ['Hand torque'] }, 1)).rejects.toMatchObject({ code: 'not_found' });
    await expect(decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'pass', scopes: [] }, 1)).rejects.toMatchObject({ code: 'invalid_input' });
  });

  it('issues a PDF on A4 and Letter whose text names the trainee, course, scope, code and dates, with the fonts embedded', async () => {
    // Nothing of the evidence is entered here, so the pass carries an override reason (tests/integration/course-evidence.test.ts covers the rule).
    await decideCourseOutcome(instructor, cohortId, trainee.id, { decision: 'pass', scopes: ['Hand torque', 'Tensioning'], overrideReason: 'Assessed at the previous centre (test)' }, 1);
    await setRecordValidity(instructor, cohortId, { months: 24 });
    const issuedAt = new Date('2026-12-03T10:00:00Z');
    const record = await issueTrainingRecord(instructor, cohortId, trainee.id, issuedAt);
    // 24 months after 3 Dec 2026 (the cohort's setting, computed by hand).
    expect(record).toMatchObject({ issuedOn: '2026-12-03', validUntil: '2028-12-03', status: 'valid', scope: 'Hand torque, Tensioning' });
    await expect(issueTrainingRecord(instructor, cohortId, trainee.id)).rejects.toMatchObject({ code: 'conflict' });

    const a4 = pdfText((await trainingRecordPdf(instructor, record.id, 'a4')).bytes, 'a4.pdf');
    const dashed = record.code.match(/.{4}/g)!.join('-');
    for (const expected of [trainee.name, courseName, 'Hand torque, Tensioning', dashed, '3 Dec 2026', '3 Dec 2028', `/verify/${record.code}`]) expect(a4.text).toContain(expected);
    // Page sizes in points: ISO 216 A4 = 210 × 297 mm = 595.28 × 841.89 pt; US Letter = 8.5 × 11 in = 612 × 792 pt.
    expect(a4.info).toMatch(/Page size:\s+595\.2\d? x 841\.8\d? pts \(A4\)/);
    // pdffonts: "emb" yes for both fonts (pdf-lib subsets them without the ABCDEF+ name prefix, so "sub" reads no).
    expect(a4.fonts).toMatch(/DejaVuSans-\d+\s+CID TrueType\s+Identity-H\s+yes/);
    expect(a4.fonts).toMatch(/DejaVuSans-Bold-\d+\s+CID TrueType\s+Identity-H\s+yes/);
    const letter = pdfText((await trainingRecordPdf(trainee, record.id)).bytes, 'letter.pdf');
    expect(letter.text).toContain(dashed);
    expect(letter.info).toMatch(trainee.units === 'us' ? /612 x 792 pts \(letter\)/ : /\(A4\)/);
    expect((await trainingRecordPdf(trainee, record.id, 'letter')).bytes.length).toBeGreaterThan(1000);
    await expect(trainingRecordPdf(otherInstructor, record.id)).rejects.toMatchObject({ code: 'not_found' });
    expect(await count("SELECT COUNT(*) AS n FROM audit_log WHERE object_type = 'training_record' AND object_id = ? AND action = 'issue' AND actor_id = ?", [record.id, instructor.id])).toBe(1);
  });

  it('shows only name, course, scope, dates and status to a stranger; revoked and replaced codes say so; unknown codes say nothing more', async () => {
    const id = Number((await sequelize.query<{ id: number }>('SELECT id FROM training_records WHERE cohort_id = ? AND revoked_at IS NULL', { type: QueryTypes.SELECT, replacements: [cohortId] }))[0]!.id);
    const first = (await sequelize.query<{ code: string }>('SELECT code FROM training_records WHERE id = ?', { type: QueryTypes.SELECT, replacements: [id] }))[0]!.code;
    const now = new Date('2027-01-10T00:00:00Z');
    expect(await verifyTrainingRecord(first.toLowerCase().replace(/(.{4})/g, '$1-'), address, now)).toEqual({
      kind: 'found',
      record: { traineeName: trainee.name, courseName, scope: 'Hand torque, Tensioning', issuedOn: '2026-12-03', validUntil: '2028-12-03', status: 'valid' },
    });
    expect(await verifyTrainingRecord(first, address, new Date('2028-12-04T00:00:00Z'))).toMatchObject({ record: { status: 'expired' } });
    expect(await verifyTrainingRecord('ZZZZZZZZZZZZZZZZ', address, now)).toEqual({ kind: 'unknown' });

    const fresh = await reissueTrainingRecord(instructor, id, now);
    expect(fresh.code).not.toBe(first);
    expect(await verifyTrainingRecord(first, address, now)).toMatchObject({ record: { status: 'replaced' } });
    await expect(revokeTrainingRecord(instructor, fresh.id, 'no')).rejects.toMatchObject({ code: 'invalid_input' });
    await revokeTrainingRecord(instructor, fresh.id, 'Issued in error', now);
    expect(await verifyTrainingRecord(fresh.code, address, now)).toMatchObject({ record: { status: 'revoked' } });
    await expect(revokeTrainingRecord(instructor, fresh.id, 'again please')).rejects.toMatchObject({ code: 'conflict' });
    expect(await count("SELECT COUNT(*) AS n FROM audit_log WHERE object_type = 'training_record' AND object_id = ? AND action = 'revoke' AND reason = 'Issued in error'", [fresh.id])).toBe(1);
  });

  it('limits look-ups per client address, kept in MariaDB', async () => {
    await sequelize.query('DELETE FROM sign_in_attempts WHERE attempt_key = ?', { replacements: [verifyKey(address)] });
    const now = new Date();
    for (let i = 0; i < VERIFY_LIMIT.lookups; i += 1) expect((await verifyTrainingRecord('ZZZZZZZZZZZZZZZZ', address, now)).kind).toBe('unknown');
    expect((await verifyTrainingRecord('ZZZZZZZZZZZZZZZZ', address, now)).kind).toBe('rate_limited');
    expect((await verifyTrainingRecord('ZZZZZZZZZZZZZZZZ', '198.51.100.7', now)).kind).toBe('unknown');
    await sequelize.query("DELETE FROM sign_in_attempts WHERE attempt_key = 'verify:198.51.100.7'");
  });
});

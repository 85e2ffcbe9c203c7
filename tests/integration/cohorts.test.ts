import Papa from 'papaparse';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashToken } from '@/lib/accounts/one-time-token';
import { sequelize } from '@/lib/platform/db';
import { criteriaForCohort, saveCohortCriteria, signOffRun, sendRunResults } from '@/lib/data/assessment';
import { cohortDetail, createCohort } from '@/lib/data/cohorts';
import { exportRunsCsv } from '@/lib/data/exports';
import { inviteToCohort, requestPasswordReset, setPasswordWithToken } from '@/lib/data/invitations';
import { changeRole, setActive } from '@/lib/data/people';
import { verifyPassword } from '@/lib/auth/passwords';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { jointTarget, storeFixtureRun } from './run-fixture';
import { count, demoPeople, mailTo, tableCounts } from './support';

const stamp = Date.now().toString(36);
const newAddress = (label: string) => `${label}.${stamp}@test.evenload.test`;
let instructor: SessionUser;
let otherInstructor: SessionUser;
let trainee: SessionUser;
let researcher: SessionUser;
let admin: SessionUser;
let cohortId: number;
const createdEmails: string[] = [];

const linkIn = (text: string, path: 'welcome' | 'reset') => {
  const match = text.match(new RegExp(`https?://\\S+/${path}/([A-Za-z0-9_-]{43})`));
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return match[1]!;
};

beforeAll(async () => {
  ({ instructor, otherInstructor, trainee, researcher, admin } = await demoPeople());
  cohortId = await createCohort(instructor, { name: `Test cohort ${stamp}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
});

afterAll(async () => {
  await sequelize.query('DELETE FROM runs WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  if (createdEmails.length) await sequelize.query('DELETE FROM users WHERE email IN (?)', { replacements: [createdEmails] });
  await sequelize.close();
});

describe('inviting trainees', () => {
  it('refuses a list with any invalid entry, names every one, and saves nothing', async () => {
    const before = await tableCounts();
    const attempt = inviteToCohort(instructor, cohortId, `${newAddress('valid')}, not-an-address; also@@wrong`);
    await expect(attempt).rejects.toMatchObject({ code: 'invalid_input', message: expect.stringContaining('"not-an-address", "also@@wrong"') });
    expect(await tableCounts()).toEqual(before);
  });

  it('refuses a trainee and a researcher, and an instructor of another cohort, changing no row', async () => {
    const before = await tableCounts();
    await expect(inviteToCohort(trainee, cohortId, newAddress('x'))).rejects.toMatchObject({ code: 'forbidden' });
    await expect(inviteToCohort(researcher, cohortId, newAddress('x'))).rejects.toMatchObject({ code: 'forbidden' });
    await expect(inviteToCohort(otherInstructor, cohortId, newAddress('x'))).rejects.toMatchObject({ code: 'not_found' });
    expect(await tableCounts()).toEqual(before);
  });

  it('creates a new trainee with a hashed single-use link, and attaches an existing account instead of duplicating it', async () => {
    const fresh = newAddress('fresh');
    createdEmails.push(fresh);
    const users = await count('SELECT COUNT(*) AS n FROM users');
    const outcome = await inviteToCohort(instructor, cohortId, `Fresh Person <${fresh.toUpperCase()}>\n${DEMO_ACCOUNTS.trainee}`);
    expect(outcome).toMatchObject({ invited: [fresh], attached: [DEMO_ACCOUNTS.trainee], notSent: [] });
    expect(await count('SELECT COUNT(*) AS n FROM users')).toBe(users + 1);
    expect(await count('SELECT COUNT(*) AS n FROM cohort_members WHERE cohort_id = ?', [cohortId])).toBe(2);
    const [mail] = await mailTo(fresh);
    expect(mail?.subject).toContain(`Test cohort ${stamp}`);
    const token = linkIn(mail!.text_body, 'welcome');
    // Only the hash is stored.
    expect(await count('SELECT COUNT(*) AS n FROM one_time_tokens WHERE token_sha256 = ?', [token])).toBe(0);
    expect(await count("SELECT COUNT(*) AS n FROM one_time_tokens WHERE token_sha256 = ? AND purpose = 'invite' AND expires_at > NOW() + INTERVAL 71 HOUR", [hashToken(token)])).toBe(1);
    expect((await mailTo(DEMO_ACCOUNTS.trainee)).some((m) => m.subject.includes('You were added'))).toBe(true);
    // Inviting the existing member again does nothing.
    const again = await inviteToCohort(instructor, cohortId, DEMO_ACCOUNTS.trainee);
    expect(again.alreadyMembers).toEqual([DEMO_ACCOUNTS.trainee]);
  });
});

describe('one-time links', () => {
  it('sets the password once; a second use is refused and changes nothing', async () => {
    const email = newAddress('once');
    createdEmails.push(email);
    await inviteToCohort(instructor, cohortId, email);
    const token = linkIn((await mailTo(email))[0]!.text_body, 'welcome');
    await expect(setPasswordWithToken(token, 'invite', { name: 'Ona Test', password: 'short', confirm: 'short' })).rejects.toMatchObject({ code: 'invalid_input' });
    await expect(setPasswordWithToken(token, 'invite', { password: 'long enough pass', confirm: 'long enough pass' })).rejects.toMatchObject({ details: { fieldErrors: { name: [expect.stringContaining('Enter your name')] } } });
    await expect(setPasswordWithToken(token, 'invite', { name: 'Ona Test', password: 'long enough pass', confirm: 'long enough typo' })).rejects.toMatchObject({ code: 'invalid_input' });
    expect(await count('SELECT COUNT(*) AS n FROM users WHERE email = ? AND password_hash IS NULL', [email])).toBe(1);

    await expect(setPasswordWithToken(token, 'invite', { name: 'Ona Test', password: 'first good password', confirm: 'first good password' })).resolves.toEqual({ email });
    const [row] = await sequelize.query<{ password_hash: string; name: string }>('SELECT password_hash, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [email] });
    expect(row!.name).toBe('Ona Test');
    await expect(setPasswordWithToken(token, 'invite', { name: 'Someone Else', password: 'second password here', confirm: 'second password here' })).rejects.toMatchObject({ code: 'conflict', message: expect.stringContaining('already been used') });
    const [after] = await sequelize.query<{ password_hash: string }>('SELECT password_hash FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [email] });
    expect(after!.password_hash).toBe(row!.password_hash);
    expect(await verifyPassword('first good password', after!.password_hash)).toBe(true);
  });

  it('refuses an expired link and changes nothing', async () => {
    const email = newAddress('late');
    createdEmails.push(email);
    await inviteToCohort(instructor, cohortId, email);
    const token = linkIn((await mailTo(email))[0]!.text_body, 'welcome');
    await sequelize.query('UPDATE one_time_tokens SET expires_at = NOW() - INTERVAL 1 MINUTE WHERE token_sha256 = ?', { replacements: [hashToken(token)] });
    const before = await tableCounts();
    await expect(setPasswordWithToken(token, 'invite', { name: 'Late Person', password: 'a fine password', confirm: 'a fine password' })).rejects.toMatchObject({ message: expect.stringContaining('expired') });
    expect(await tableCounts()).toEqual(before);
    expect(await count('SELECT COUNT(*) AS n FROM users WHERE email = ? AND password_hash IS NULL', [email])).toBe(1);
  });

  it('does not use an invitation link as a reset link', async () => {
    const email = newAddress('wrongkind');
    createdEmails.push(email);
    await inviteToCohort(instructor, cohortId, email);
    const token = linkIn((await mailTo(email))[0]!.text_body, 'welcome');
    await expect(setPasswordWithToken(token, 'reset', { password: 'a fine password', confirm: 'a fine password' })).rejects.toMatchObject({ code: 'not_found' });
  });

  it('sends a reset link to an existing account and nothing for an unknown address', async () => {
    const tokens = await count('SELECT COUNT(*) AS n FROM one_time_tokens');
    const mails = await count('SELECT COUNT(*) AS n FROM captured_mail');
    await requestPasswordReset(newAddress('nobody'));
    expect(await count('SELECT COUNT(*) AS n FROM one_time_tokens')).toBe(tokens);
    expect(await count('SELECT COUNT(*) AS n FROM captured_mail')).toBe(mails);
    await requestPasswordReset(DEMO_ACCOUNTS.researcher.toUpperCase());
    const reset = (await mailTo(DEMO_ACCOUNTS.researcher)).filter((m) => m.subject.includes('Reset'));
    expect(reset.length).toBeGreaterThan(0);
    expect(linkIn(reset[reset.length - 1]!.text_body, 'reset')).toHaveLength(43);
  });

  it('audits the account an invitation creates, its acceptance and a password reset, never with a hash or a token', async () => {
    const email = newAddress('audited');
    createdEmails.push(email);
    await inviteToCohort(instructor, cohortId, email);
    const [account] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [email] });
    const invite = linkIn((await mailTo(email))[0]!.text_body, 'welcome');
    await setPasswordWithToken(invite, 'invite', { name: 'Audit Person', password: 'an audited password', confirm: 'an audited password' });
    await requestPasswordReset(email);
    const reset = linkIn((await mailTo(email)).filter((m) => m.subject.includes('Reset')).at(-1)!.text_body, 'reset');
    await setPasswordWithToken(reset, 'reset', { password: 'a second password', confirm: 'a second password' });
    const rows = await sequelize.query<{ actor_id: number; action: string; before_json: string | null; after_json: string }>(
      "SELECT actor_id, action, before_json, after_json FROM audit_log WHERE object_type = 'account' AND object_id = ? ORDER BY id",
      { type: QueryTypes.SELECT, replacements: [account!.id] },
    );
    expect(rows.map((r) => [Number(r.actor_id), r.action])).toEqual([[instructor.id, 'invite_create'], [Number(account!.id), 'accept_invitation'], [Number(account!.id), 'password_reset']]);
    expect(JSON.parse(rows[0]!.after_json)).toMatchObject({ email, role: 'trainee', pending: true });
    expect(JSON.parse(rows[1]!.before_json!)).toMatchObject({ pending: true });
    expect(JSON.parse(rows[1]!.after_json)).toMatchObject({ name: 'Audit Person', pending: false, passwordSet: true });
    const [{ password_hash: hash }] = (await sequelize.query<{ password_hash: string }>('SELECT password_hash FROM users WHERE id = ?', { type: QueryTypes.SELECT, replacements: [account!.id] })) as [{ password_hash: string }];
    const written = rows.map((r) => `${r.before_json ?? ''}${r.after_json}`).join(' ');
    for (const secret of [hash, invite, reset, hashToken(invite), hashToken(reset), 'an audited password', 'a second password']) expect(written).not.toContain(secret);
  });

  it('sends at most 5 reset mails per address in 15 minutes, silently', async () => {
    await sequelize.query('DELETE FROM sign_in_attempts WHERE attempt_key = ?', { replacements: [`reset:${DEMO_ACCOUNTS.instructor}`] });
    const before = (await mailTo(DEMO_ACCOUNTS.instructor)).length;
    for (let i = 0; i < 7; i += 1) await requestPasswordReset(DEMO_ACCOUNTS.instructor);
    expect((await mailTo(DEMO_ACCOUNTS.instructor)).length - before).toBe(5);
    await sequelize.query('DELETE FROM sign_in_attempts WHERE attempt_key = ?', { replacements: [`reset:${DEMO_ACCOUNTS.instructor}`] });
  });
});

describe('criteria and verdicts', () => {
  it('refuses criteria outside sensible limits, naming the field, and saves nothing', async () => {
    const before = await tableCounts();
    await expect(saveCohortCriteria(instructor, cohortId, { bandPercent: 60, maxCvPercent: 5, requirePattern: true, maxYieldPercent: 70 }, 0)).rejects.toMatchObject({
      code: 'invalid_input',
      details: { fieldErrors: { bandPercent: [expect.stringContaining('between 1 and 30 %')] } },
    });
    await expect(saveCohortCriteria(trainee, cohortId, { bandPercent: 10, maxCvPercent: 5, requirePattern: true, maxYieldPercent: 70 }, 0)).rejects.toMatchObject({ code: 'forbidden' });
    expect(await tableCounts()).toEqual(before);
  });

  it('judges a run, refuses a researcher sign-off, and stores one signed snapshot for the instructor', async () => {
    await saveCohortCriteria(instructor, cohortId, { bandPercent: 10, maxCvPercent: 5, requirePattern: true, maxYieldPercent: 70 }, (await criteriaForCohort(cohortId)).version);
    const target = await jointTarget();
    const finalLoadsN = [0.95, 1.05, 1, 1, 0.98, 1.02, 0.99, 1.01].map((f) => f * target);
    const runId = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN });
    const detail = await cohortDetail(instructor, cohortId);
    const judged = detail.runs.find((r) => r.id === runId)!;
    expect(judged.judgement?.allMet).toBe(true);
    // CV by hand: s/x̄ of 0.95..1.05 × target = sqrt(60/7) % (see tests/lib/judge-run.test.ts).
    expect(judged.judgement?.results.find((r) => r.key === 'cv')?.measured).toBeCloseTo(Math.sqrt(60 / 7), 8);

    const verdicts = await count('SELECT COUNT(*) AS n FROM run_verdicts');
    await expect(signOffRun(researcher, runId, 'no')).rejects.toMatchObject({ code: 'forbidden' });
    await expect(signOffRun(otherInstructor, runId, 'no')).rejects.toMatchObject({ code: 'not_found' });
    expect(await count('SELECT COUNT(*) AS n FROM run_verdicts')).toBe(verdicts);

    await signOffRun(instructor, runId, 'Even work; keep the pass order.');
    await expect(signOffRun(instructor, runId, 'again')).rejects.toMatchObject({ code: 'conflict' });
    const [verdict] = await sequelize.query<{ criteria: unknown; all_met: number; comment: string }>('SELECT criteria, all_met, comment FROM run_verdicts WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    expect(typeof verdict!.criteria === 'string' ? JSON.parse(verdict!.criteria) : verdict!.criteria).toMatchObject({ bandPercent: 10, maxCvPercent: 5 });
    expect(Boolean(verdict!.all_met)).toBe(true);

    // A later change of the criteria does not change the signed snapshot.
    await saveCohortCriteria(instructor, cohortId, { bandPercent: 2, maxCvPercent: 1, requirePattern: true, maxYieldPercent: 70 }, (await criteriaForCohort(cohortId)).version);
    const later = (await cohortDetail(instructor, cohortId)).runs.find((r) => r.id === runId)!;
    expect(later.verdict?.allMet).toBe(true);
    expect(later.judgement?.allMet).toBe(false);

    await expect(sendRunResults(trainee, runId, false)).rejects.toMatchObject({ code: 'forbidden' });
    const sent = await sendRunResults(instructor, runId, true);
    expect(sent.to).toBe(DEMO_ACCOUNTS.trainee);
    const results = (await mailTo(DEMO_ACCOUNTS.trainee)).filter((m) => m.subject.includes('run result'));
    expect(results[results.length - 1]!.text_body).toContain(`/runs/${runId}`);
  });
});

describe('people', () => {
  it('an admin cannot change their own role or deactivate themselves; an instructor cannot change roles', async () => {
    await expect(changeRole(admin, admin.id, 'trainee')).rejects.toMatchObject({ code: 'forbidden' });
    await expect(setActive(admin, admin.id, false)).rejects.toMatchObject({ code: 'forbidden' });
    await expect(changeRole(instructor, instructor.id, 'admin')).rejects.toMatchObject({ code: 'forbidden' });
    await expect(changeRole(instructor, trainee.id, 'admin')).rejects.toMatchObject({ code: 'forbidden' });
    expect(await count("SELECT COUNT(*) AS n FROM users WHERE id = ? AND role = 'admin' AND is_active = 1", [admin.id])).toBe(1);
    expect(await count("SELECT COUNT(*) AS n FROM users WHERE id = ? AND role = 'instructor'", [instructor.id])).toBe(1);
  });

  it('an admin changes another account’s role and refuses an unknown role', async () => {
    const email = newAddress('promote');
    createdEmails.push(email);
    await inviteToCohort(instructor, cohortId, email);
    const [row] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [email] });
    await expect(changeRole(admin, row!.id, 'overlord')).rejects.toMatchObject({ code: 'invalid_input' });
    await changeRole(admin, row!.id, 'researcher');
    expect(await count("SELECT COUNT(*) AS n FROM users WHERE id = ? AND role = 'researcher'", [row!.id])).toBe(1);
  });
});

describe('research export', () => {
  it('has one line per reading, pseudonyms stable per key, and no name or e-mail of anyone', async () => {
    const [cohort] = await sequelize.query<{ id: number }>('SELECT id FROM cohorts WHERE instructor_id = ? ORDER BY id LIMIT 1', { type: QueryTypes.SELECT, replacements: [instructor.id] });
    const collect = async (key: string) => {
      let text = '';
      for await (const chunk of exportRunsCsv(researcher, { key, cohortId: cohort!.id })) text += chunk;
      return text;
    };
    const csv = await collect('study-key-one');
    const lines = csv.trim().split('\r\n');
    const parsed = Papa.parse<string[]>(csv.trim()).data;
    expect(parsed.every((cells) => cells.length === 12)).toBe(true);
    expect(parsed.slice(1).every((cells) => /^Operator [A-Z2-9]{6}$/.test(cells[6] ?? ''))).toBe(true);
    expect(lines[0]).toBe('run_id,recorded_at,joint,method,lubricant,cohort,operator,step,pass,tightened_position,position,load_n');
    const readings = await count("SELECT COUNT(*) AS n FROM readings r JOIN runs u ON u.id = r.run_id WHERE u.cohort_id = ? AND u.status = 'complete'", [cohort!.id]);
    expect(readings).toBeGreaterThan(0);
    expect(lines.length - 1).toBe(readings);
    const people = await sequelize.query<{ name: string; email: string }>('SELECT name, email FROM users', { type: QueryTypes.SELECT });
    for (const person of people) {
      expect(csv.includes(person.name), `name ${person.name} in the export`).toBe(false);
      expect(csv.toLowerCase().includes(person.email.toLowerCase()), `e-mail ${person.email} in the export`).toBe(false);
    }
    const operators = (text: string) => [...new Set(Papa.parse<string[]>(text.trim()).data.slice(1).map((cells) => cells[6]))];
    expect(operators(await collect('study-key-one'))).toEqual(operators(csv));
    expect(operators(await collect('study-key-two'))).not.toEqual(operators(csv));
    const instructorExport = exportRunsCsv(instructor, { key: 'study-key-one' });
    await expect(instructorExport.next()).rejects.toMatchObject({ code: 'forbidden' });
  });
});

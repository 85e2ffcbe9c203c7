import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { getLubricant, getMethod } from '@/lib/data/joints';
import { STALE_EDIT_MESSAGE } from '@/lib/data/optimistic-lock';
import type { SessionUser } from '@/lib/auth/session';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { actionOutcome } from './support';

// Issue 13 (low): six simultaneous edits of one lubricant all reported "saved"; the last writer won silently.
const TAG = `itest-versions-${Date.now()}`;
const instructor: SessionUser = { id: 1, name: 'instructor', email: 'instructor@demo.evenload.test', role: 'instructor', units: 'si' };

// The real server actions, signed in as the instructor above; a save sends the browser back to the list.
vi.mock('@/lib/auth/session', async (importOriginal) => ({ ...(await importOriginal<typeof import('@/lib/auth/session')>()), getSessionUser: async () => instructor }));
vi.mock('next/cache', () => ({ revalidatePath: vi.fn() }));
const { saveLubricantAction, saveMethodAction } = await import('@/app/(lab)/joints/actions');
const saveLubricant = (id: number | null, data: FormData) => actionOutcome(saveLubricantAction(id, IDLE_FORM_STATE, data));
const saveMethod = (id: number | null, data: FormData) => actionOutcome(saveMethodAction(id, IDLE_FORM_STATE, data));
const saved = (outcome: object) => 'redirectedTo' in outcome;
const idByName = async (table: 'lubricants' | 'methods', name: string) =>
  Number((await sequelize.query<{ id: number }>(`SELECT id FROM ${table} WHERE name = ?`, { type: QueryTypes.SELECT, replacements: [name] }))[0]!.id);

const form = (entries: Record<string, string>) => {
  const data = new FormData();
  for (const [key, value] of Object.entries(entries)) data.set(key, value);
  return data;
};

afterAll(async () => {
  await sequelize.query('DELETE FROM methods WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM lubricants WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});

describe('optimistic locking of library edits', () => {
  it('six simultaneous edits of one lubricant: one saves, five are told it changed since they opened it', async () => {
    expect(saved(await saveLubricant(null, form({ name: `${TAG} paste`, nominalNutFactor: '0.15' })))).toBe(true);
    const id = await idByName('lubricants', `${TAG} paste`);
    const opened = await getLubricant(instructor, id);
    const edits = [0.11, 0.12, 0.13, 0.14, 0.16, 0.17].map((k) => form({ name: `${TAG} paste`, nominalNutFactor: String(k), version: String(opened!.version) }));
    const states = await Promise.all(edits.map((data) => saveLubricant(id, data)));
    expect(states.filter(saved)).toHaveLength(1);
    const stale = states.filter((s) => !saved(s));
    expect(stale).toHaveLength(5);
    for (const state of stale) expect(state).toMatchObject({ status: 'error', code: 'conflict', message: STALE_EDIT_MESSAGE });
    expect(STALE_EDIT_MESSAGE).toContain('changed by someone else since you opened it; reload');
    // The stored K is the one the saved edit sent, and the version moved on by exactly one.
    const winner = states.findIndex(saved);
    const after = await getLubricant(instructor, id);
    expect(after?.nominalNutFactor).toBeCloseTo(0.11 + [0, 0.01, 0.02, 0.03, 0.05, 0.06][winner]!, 12);
    expect(after?.version).toBe(opened!.version + 1);
  });

  it('a form opened before a save changes nothing, and a form without a version is not trusted', async () => {
    expect(saved(await saveMethod(null, form({ name: `${TAG} method`, toolKind: 'other', checkPasses: '0', notes: '', passCount: '1', studCounts: '8', 'pass-0-percent': '100', 'pass-0-order-8': '1 2 3 4 5 6 7 8' })))).toBe(true);
    const id = await idByName('methods', `${TAG} method`);
    const opened = await getMethod(instructor, id);
    const edit = (notes: string, version?: number) =>
      form({ name: `${TAG} method`, toolKind: 'other', checkPasses: '0', notes, passCount: '1', studCounts: '8', 'pass-0-percent': '100', 'pass-0-order-8': '1 2 3 4 5 6 7 8', ...(version === undefined ? {} : { version: String(version) }) });
    expect(saved(await saveMethod(id, edit('first', opened!.version)))).toBe(true);
    expect(await saveMethod(id, edit('stale', opened!.version))).toMatchObject({ status: 'error', code: 'conflict' });
    expect(await saveMethod(id, edit('no version'))).toMatchObject({ status: 'error', code: 'conflict' });
    const [row] = await sequelize.query<{ notes: string }>('SELECT notes FROM methods WHERE id = ?', { type: QueryTypes.SELECT, replacements: [id] });
    expect(row?.notes).toBe('first');
  });
});

describe('names', () => {
  it('a lubricant name of only zero-width and bidi-override characters is refused and nothing is written', async () => {
    // U+200B ZERO WIDTH SPACE, U+202E RIGHT-TO-LEFT OVERRIDE, U+2069 POP DIRECTIONAL ISOLATE (Unicode, category Cf).
    const [before] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM lubricants', { type: QueryTypes.SELECT });
    const state = await saveLubricant(null, form({ name: '\u200B\u202E\u2069', nominalNutFactor: '0.15' }));
    expect(state).toMatchObject({ status: 'error', code: 'invalid_input', fieldErrors: { name: ['Enter the lubricant name.'] } });
    const [after] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM lubricants', { type: QueryTypes.SELECT });
    expect(Number(after!.n)).toBe(Number(before!.n));
  });

  it('a lubricant name is stored in NFC', async () => {
    // "e" + U+0301 COMBINING ACUTE ACCENT is U+00E9 in NFC (Unicode Standard Annex #15).
    expect(saved(await saveLubricant(null, form({ name: `${TAG} Cafe\u0301`, nominalNutFactor: '0.15' })))).toBe(true);
    const [row] = await sequelize.query<{ name: string }>('SELECT name FROM lubricants WHERE name LIKE ?', { type: QueryTypes.SELECT, replacements: [`${TAG} Caf%`] });
    expect(row?.name).toBe(`${TAG} Caf\u00e9`);
  });
});

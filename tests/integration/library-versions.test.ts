import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { getLubricant, getMethod } from '@/lib/data/joints';
import { STALE_EDIT_MESSAGE } from '@/lib/data/optimistic-lock';
import { handleLubricantSave, handleMethodSave } from '@/lib/data/library-forms';
import type { SessionUser } from '@/lib/auth/session';

// Issue 13 (low): six simultaneous edits of one lubricant all reported "saved"; the last writer won silently.
const TAG = `itest-versions-${Date.now()}`;
const instructor: SessionUser = { id: 1, name: 'instructor', email: 'instructor@demo.evenload.test', role: 'instructor', units: 'si' };

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
    const created = await handleLubricantSave(instructor, null, form({ name: `${TAG} paste`, nominalNutFactor: '0.15' }));
    const id = created.savedId!;
    const opened = await getLubricant(instructor, id);
    const edits = [0.11, 0.12, 0.13, 0.14, 0.16, 0.17].map((k) => form({ name: `${TAG} paste`, nominalNutFactor: String(k), version: String(opened!.version) }));
    const states = await Promise.all(edits.map((data) => handleLubricantSave(instructor, id, data)));
    expect(states.filter((s) => s.status === 'saved')).toHaveLength(1);
    const stale = states.filter((s) => s.status === 'error');
    expect(stale).toHaveLength(5);
    for (const state of stale) expect(state).toMatchObject({ code: 'conflict', message: STALE_EDIT_MESSAGE });
    expect(STALE_EDIT_MESSAGE).toContain('changed by someone else since you opened it; reload');
    // The stored K is the one the saved edit sent, and the version moved on by exactly one.
    const winner = states.findIndex((s) => s.status === 'saved');
    const after = await getLubricant(instructor, id);
    expect(after?.nominalNutFactor).toBeCloseTo(0.11 + [0, 0.01, 0.02, 0.03, 0.05, 0.06][winner]!, 12);
    expect(after?.version).toBe(opened!.version + 1);
  });

  it('a form opened before a save changes nothing, and a form without a version is not trusted', async () => {
    const created = await handleMethodSave(instructor, null, form({ name: `${TAG} method`, toolKind: 'other', checkPasses: '0', notes: '', passCount: '1', studCounts: '8', 'pass-0-percent': '100', 'pass-0-order-8': '1 2 3 4 5 6 7 8' }));
    const id = created.savedId!;
    const opened = await getMethod(instructor, id);
    const edit = (notes: string, version?: number) =>
      form({ name: `${TAG} method`, toolKind: 'other', checkPasses: '0', notes, passCount: '1', studCounts: '8', 'pass-0-percent': '100', 'pass-0-order-8': '1 2 3 4 5 6 7 8', ...(version === undefined ? {} : { version: String(version) }) });
    expect((await handleMethodSave(instructor, id, edit('first', opened!.version))).status).toBe('saved');
    expect(await handleMethodSave(instructor, id, edit('stale', opened!.version))).toMatchObject({ status: 'error', code: 'conflict' });
    expect(await handleMethodSave(instructor, id, edit('no version'))).toMatchObject({ status: 'error', code: 'conflict' });
    const [row] = await sequelize.query<{ notes: string }>('SELECT notes FROM methods WHERE id = ?', { type: QueryTypes.SELECT, replacements: [id] });
    expect(row?.notes).toBe('first');
  });
});

describe('names', () => {
  it('a lubricant name of only zero-width and bidi-override characters is refused and nothing is written', async () => {
    // U+200B ZERO WIDTH SPACE, U+202E RIGHT-TO-LEFT OVERRIDE, U+2069 POP DIRECTIONAL ISOLATE (Unicode, category Cf).
    const [before] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM lubricants', { type: QueryTypes.SELECT });
    const state = await handleLubricantSave(instructor, null, form({ name: '\u200B\u202E\u2069', nominalNutFactor: '0.15' }));
    expect(state).toMatchObject({ status: 'error', code: 'invalid_input', errors: { name: ['Enter the lubricant name.'] } });
    const [after] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM lubricants', { type: QueryTypes.SELECT });
    expect(Number(after!.n)).toBe(Number(before!.n));
  });

  it('a lubricant name is stored in NFC', async () => {
    // "e" + U+0301 COMBINING ACUTE ACCENT is U+00E9 in NFC (Unicode Standard Annex #15).
    const state = await handleLubricantSave(instructor, null, form({ name: `${TAG} Cafe\u0301`, nominalNutFactor: '0.15' }));
    const [row] = await sequelize.query<{ name: string }>('SELECT name FROM lubricants WHERE id = ?', { type: QueryTypes.SELECT, replacements: [state.savedId] });
    expect(row?.name).toBe(`${TAG} Caf\u00e9`);
  });
});

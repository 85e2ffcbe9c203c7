import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { saveJoint, getJoint } from '@/lib/data/joints';
import { calibrationHistory, recordCalibration } from '@/lib/data/calibration';
import { calibrationSession as session, fourStudJoint as jointInput, tableFor } from './calibration-fixture';
import type { SessionUser } from '@/lib/auth/session';

const TAG = `itest-calibration-${Date.now()}`;
const instructor: SessionUser = { id: 1, name: 'Test instructor', email: 'test@demo.evenload.test', role: 'instructor', units: 'si' };

afterAll(async () => {
  await sequelize.query('DELETE FROM joints WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});




describe('gauge calibration against MariaDB', () => {
  it('an accepted session writes the factors to the joint; a later one flags drift on the gauge whose factor left its interval', async () => {
    const { id } = await saveJoint(instructor, null, jointInput(`${TAG} joint`));
    const first = await recordCalibration(instructor, id, session('2026-02-01', [1, 1.02, 0.98, 1]));
    expect(first.accepted).toBe(true);
    // The fitted factor recovers the k the readings were made with (wobble ±0.02 kN on 20–80 kN).
    expect((await getJoint(instructor, id))!.positions.map((p) => p.calibrationFactor)).toEqual([
      expect.closeTo(1, 3), expect.closeTo(1.02, 3), expect.closeTo(0.98, 3), expect.closeTo(1, 3),
    ]);
    const second = await recordCalibration(instructor, id, session('2026-08-01', [1, 1.02, 0.95, 1]));
    expect(second.accepted).toBe(true);
    const history = await calibrationHistory(instructor, id);
    expect(history).toHaveLength(2);
    expect(history[0]!.dueOn).toBe('2027-02-01'); // training default interval: 12 months
    expect(history[1]!.results.map((r) => r.drift)).toEqual([false, false, true, false]);
    expect((await getJoint(instructor, id))!.positions[2]!.calibrationFactor).toBeCloseTo(0.95, 3);
  });

  it('a refused session keeps the joint factors and stores why', async () => {
    const { id } = await saveJoint(instructor, null, jointInput(`${TAG} refused`));
    const text = tableFor([1, 1, 1, 1]).replace(/down,0,0,0,0,0$/, 'down,0,0,0,0,2');
    const result = await recordCalibration(instructor, id, { ...session('2026-02-01', [1, 1, 1, 1]), table: text });
    expect(result.accepted).toBe(false);
    const history = await calibrationHistory(instructor, id);
    // Zero return of position 4: |k·2 − 0| / 80 × 100 with k ≈ 1 → about 2.5 % (> 0.5 % training default).
    expect(history[0]!.results[3]!.refusals).toEqual([expect.stringMatching(/^zero return 2\.\d+ % over 0\.5 %$/)]);
    expect((await getJoint(instructor, id))!.positions.map((p) => p.calibrationFactor)).toEqual([1, 1, 1, 1]);
  });
});

import { describe, expect, it } from 'vitest';
import { tensileStressAreaIn2 } from '@/lib/demo/demo-library';
import { buildDemoScenario } from '@/lib/demo/demo-scenario';
import { methodForSim } from '@/lib/sim/from-library';
import { validatePassOrder } from '@/lib/sim/patterns';
import { finalLoadsN } from '@/lib/sim/simulate-run';
import { SimInputError } from '@/lib/sim/errors';
import { mean, sampleCv } from '../sim/support';

const scenario = buildDemoScenario();
const N_PER_LBF = 4.4482216152605;

describe('tensileStressAreaIn2 (As = 0.7854 (D − 0.9743/n)², docs/REFERENCE.md §1 ✓ [EE-B1.1])', () => {
  it('matches the published table areas for 5/8-11, 3/4-10 and 1-8 UNC (docs/REFERENCE.md §1 ✓ [EE-AREA])', () => {
    for (const [d, n, table] of [[0.625, 11, 0.226], [0.75, 10, 0.334], [1, 8, 0.606]] as const) {
      // Table values have three significant figures, hence the 0.2 % tolerance.
      expect(Math.abs(tensileStressAreaIn2(d, n) - table) / table).toBeLessThan(0.002);
    }
  });

  it('rejects an impossible thread', () => {
    expect(() => tensileStressAreaIn2(0.05, 10)).toThrow(SimInputError);
    expect(() => tensileStressAreaIn2(0.5, 0)).toThrow(SimInputError);
  });
});

describe('buildDemoScenario: reproducible invented data', () => {
  it('gives deep-equal output for the same seed and different runs for another seed', () => {
    expect(buildDemoScenario(20261201)).toEqual(scenario);
    expect(buildDemoScenario(7).runs.map((r) => r.run)).not.toEqual(scenario.runs.map((r) => r.run));
  });

  it('builds in well under 2 s', () => {
    const start = performance.now();
    buildDemoScenario(99);
    expect(performance.now() - start).toBeLessThan(2000);
  });

  it('says it is invented demo data', () => {
    expect(scenario.notice).toMatch(/^Invented demo data/);
  });
});

describe('buildDemoScenario: people, school and cohorts', () => {
  const byRole = (role: string) => scenario.users.filter((u) => u.role === role);

  it('has 1 admin, 2 instructors, 1 researcher and 20 trainees with unique addresses at the invented domain', () => {
    expect(byRole('admin')).toHaveLength(1);
    expect(byRole('instructor')).toHaveLength(2);
    expect(byRole('researcher')).toHaveLength(1);
    expect(byRole('trainee')).toHaveLength(20);
    const emails = scenario.users.map((u) => u.email);
    expect(new Set(emails).size).toBe(emails.length);
    for (const u of scenario.users) {
      expect(u.email).toMatch(/^[a-z.-]+@demo\.evenload\.test$/);
      expect(['si', 'us']).toContain(u.preferredUnits);
    }
  });

  it('has a school with two sites and three 2026 cohorts, each trainee in exactly one', () => {
    expect(scenario.school.sites).toHaveLength(2);
    const siteKeys = scenario.school.sites.map((s) => s.key);
    expect(scenario.cohorts).toHaveLength(3);
    const instructorEmails = byRole('instructor').map((u) => u.email);
    for (const c of scenario.cohorts) {
      expect(siteKeys).toContain(c.siteKey);
      expect(c.startsOn).toMatch(/^2026-\d\d-\d\d$/);
      expect(c.endsOn).toMatch(/^2026-\d\d-\d\d$/);
      expect(c.startsOn < c.endsOn).toBe(true);
      expect(instructorEmails).toContain(c.instructorEmail);
    }
    const members = scenario.cohorts.flatMap((c) => c.traineeEmails).sort();
    expect(members).toEqual(byRole('trainee').map((u) => u.email).sort());
  });
});

describe('buildDemoScenario: joints, methods, lubricants', () => {
  it('has the 8 × 5/8 in and 12 × 3/4 in training joints (docs/REFERENCE.md §6: NPS 4 Cl 150 ✓ [B165-T7]; NPS 6 Cl 300 from memory)', () => {
    const [a, b] = scenario.joints;
    expect(a?.studCount).toBe(8);
    expect(a?.thread).toMatchObject({ system: 'inch', diameter: 0.625, threadsPerInch: 11 });
    expect(b?.studCount).toBe(12);
    expect(b?.thread).toMatchObject({ system: 'inch', diameter: 0.75, threadsPerInch: 10 });
    for (const j of scenario.joints) {
      expect(j.studGrade).toBe('ASTM A193 B7');
      expect(j.nutGrade).toBe('ASTM A194 2H');
      expect(j.calibrationFactors).toHaveLength(j.studCount);
      for (const f of j.calibrationFactors) {
        expect(f).toBeGreaterThanOrEqual(0.97);
        expect(f).toBeLessThanOrEqual(1.03);
      }
    }
  });

  it('sets the target load at 50 % of the 105 ksi B7 yield on the table stress area (docs/REFERENCE.md §1 ✓ [EE-AREA], §2 ✓ [NANL], §4)', () => {
    const expected = { 8: 0.5 * 105_000 * 0.226 * N_PER_LBF, 12: 0.5 * 105_000 * 0.334 * N_PER_LBF };
    for (const j of scenario.joints) {
      const want = expected[j.studCount as 8 | 12];
      expect(Math.abs(j.targetLoadN - want) / want).toBeLessThan(0.002);
    }
  });

  it('has at least the four named methods, each pass covering every stud once for both joints', () => {
    const names = scenario.methods.map((m) => m.name);
    for (const n of ['One pass, cross order, 100 %', 'Three cross passes 30/60/100 % + circular check', 'One circular pass at 100 %', 'Tensioner, two passes']) {
      expect(names).toContain(n);
    }
    for (const m of scenario.methods) {
      for (const j of scenario.joints) {
        for (const pass of methodForSim({ ...m, toolKind: m.tool }, j.studCount).passes) expect(validatePassOrder(pass.order, j.studCount).message).toBeNull();
      }
    }
    const threePass = scenario.methods.find((m) => m.key === 'three-pass-cross-check');
    expect(threePass?.passes.map((p) => p.percentOfTarget)).toEqual([30, 60, 100]);
    expect(threePass?.checkPasses).toBe(1);
  });

  it('orders the lubricants by nominal K as docs/REFERENCE.md §3 does: dry 0.20 ✓ [SHIG] > copper paste > MoS₂ (from memory)', () => {
    const k = Object.fromEntries(scenario.lubricants.map((l) => [l.key, l.nominalK]));
    expect(k).toEqual({ dry: 0.2, 'copper-paste': 0.15, 'moly-paste': 0.12 });
  });
});

describe('buildDemoScenario: runs', () => {
  const userByEmail = new Map(scenario.users.map((u) => [u.email, u]));
  const cohortByKey = new Map(scenario.cohorts.map((c) => [c.key, c]));

  it('has at least 150 runs that reference existing joints, methods, lubricants, cohorts and operators', () => {
    expect(scenario.runs.length).toBeGreaterThanOrEqual(150);
    const keys = (xs: { key: string }[]) => new Set(xs.map((x) => x.key));
    const [joints, methods, lubricants] = [keys(scenario.joints), keys(scenario.methods), keys(scenario.lubricants)];
    expect(new Set(scenario.runs.map((r) => r.key)).size).toBe(scenario.runs.length);
    for (const r of scenario.runs) {
      expect(joints.has(r.jointKey) && methods.has(r.methodKey) && lubricants.has(r.lubricantKey)).toBe(true);
      const cohort = cohortByKey.get(r.cohortKey);
      const role = userByEmail.get(r.operatorEmail)?.role;
      expect(role === 'trainee' ? cohort?.traineeEmails.includes(r.operatorEmail) : cohort?.instructorEmail === r.operatorEmail).toBe(true);
      expect(r.recordedAt.slice(0, 10) >= (cohort?.startsOn ?? '')).toBe(true);
      expect(r.recordedAt.slice(0, 10) <= (cohort?.endsOn ?? '')).toBe(true);
    }
    expect(scenario.runs.some((r) => userByEmail.get(r.operatorEmail)?.role === 'instructor')).toBe(true);
  });

  it('stores runs that fit their joint and method', () => {
    for (const r of scenario.runs) {
      const joint = scenario.joints.find((j) => j.key === r.jointKey);
      const method = scenario.methods.find((m) => m.key === r.methodKey);
      expect(r.run.studCount).toBe(joint?.studCount);
      expect(r.run.targetLoadN).toBe(joint?.targetLoadN);
      expect(r.run.steps).toHaveLength((joint?.studCount ?? 0) * ((method?.passes.length ?? 0) + (method?.checkPasses ?? 0)));
      for (const step of r.run.steps) expect(step.loadsN).toHaveLength(r.run.studCount);
    }
  });

  it('sets a couple of runs aside with a reason and marks hand-entered runs without step times', () => {
    const setAside = scenario.runs.filter((r) => r.status === 'set_aside');
    expect(setAside.length).toBeGreaterThanOrEqual(2);
    expect(setAside.length).toBeLessThanOrEqual(5);
    for (const r of setAside) expect(r.setAsideReason?.length).toBeGreaterThan(10);
    for (const r of scenario.runs.filter((x) => x.status === 'complete')) expect(r.setAsideReason).toBeNull();
    const manual = scenario.runs.filter((r) => r.source === 'manual');
    expect(manual.length).toBeGreaterThan(0);
    for (const r of manual) for (const step of r.run.steps) expect(step.timeS).toBeNull();
  });

  it('shows trainees improving: steadier hands and lower final scatter on the same method later on', () => {
    const trainees = new Set(scenario.users.filter((u) => u.role === 'trainee').map((u) => u.email));
    const attempt = (n: number) => scenario.runs.filter((r) => trainees.has(r.operatorEmail) && r.attempt === n && r.status === 'complete');
    expect(mean(attempt(7).map((r) => r.simulation.operatorNoiseCv))).toBeLessThan(0.6 * mean(attempt(1).map((r) => r.simulation.operatorNoiseCv)));
    // Attempts 3 and 7 both use the three-pass cross method with a check pass.
    expect(new Set([...attempt(3), ...attempt(7)].map((r) => r.methodKey))).toEqual(new Set(['three-pass-cross-check']));
    const cv = (runs: typeof scenario.runs) => mean(runs.map((r) => sampleCv(finalLoadsN(r.run))));
    expect(cv(attempt(7))).toBeLessThan(cv(attempt(3)));
  });
});

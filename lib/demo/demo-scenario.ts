import { studDiameterM } from '@/lib/joints/joint-properties';
import type { NormalisedRun } from '@/lib/record/run-types';
import { lubricantForSim, methodForSim, simulateLibraryRun } from '@/lib/sim/from-library';
import { createRng, type Rng } from '@/lib/sim/random';
import type { SimulateRunMeta } from '@/lib/sim/simulate-run';
import { buildJoint, buildLubricants, buildMethods, type DemoJoint, type DemoLubricant, type DemoMethod } from './demo-library';
import { DEMO_EMAIL_DOMAIN, DEMO_NOTICE } from './notice';

/**
 * INVENTED DEMO DATA. Everything this module builds — the school, its sites, people, e-mail
 * addresses, cohorts and runs — is fictional, made for demonstrating and testing Evenload. Any
 * resemblance to real people or organisations is coincidental. The runs come from the simulator
 * through the same library adapter as Record and the Classroom (lib/sim/from-library.ts), not
 * from real strain-gauged studs. The joint library itself is in ./demo-library.ts.
 *
 * Pure and deterministic: `buildDemoScenario(seed)` returns plain objects (no database) and the
 * same seed gives deep-equal output.
 */

export type DemoRole = 'admin' | 'instructor' | 'researcher' | 'trainee';

export interface DemoUser {
  email: string;
  name: string;
  role: DemoRole;
  preferredUnits: 'si' | 'us';
}

export interface DemoSite {
  key: string;
  name: string;
  town: string;
}

export interface DemoSchool {
  key: string;
  name: string;
  sites: DemoSite[];
}

export interface DemoCohort {
  key: string;
  name: string;
  siteKey: string;
  /** ISO date (YYYY-MM-DD). */
  startsOn: string;
  /** ISO date (YYYY-MM-DD). */
  endsOn: string;
  instructorEmail: string;
  traineeEmails: string[];
}

export type DemoRunSource = 'simulated' | 'manual';
export type DemoRunStatus = 'complete' | 'set_aside';

export interface DemoRun {
  key: string;
  jointKey: string;
  methodKey: string;
  lubricantKey: string;
  operatorEmail: string;
  cohortKey: string;
  /** 1-based attempt number of this operator. */
  attempt: number;
  /** ISO date-time in UTC. */
  recordedAt: string;
  /** How the run came in, in the demo story ('manual' = typed into the grid, so no step times). */
  source: DemoRunSource;
  status: DemoRunStatus;
  setAsideReason: string | null;
  run: NormalisedRun;
  /** What the simulator drew for this run. */
  simulation: SimulateRunMeta;
}

export interface DemoScenario {
  notice: string;
  seed: number;
  users: DemoUser[];
  school: DemoSchool;
  cohorts: DemoCohort[];
  joints: DemoJoint[];
  methods: DemoMethod[];
  lubricants: DemoLubricant[];
  runs: DemoRun[];
}

function user(name: string, role: DemoRole, preferredUnits: 'si' | 'us'): DemoUser {
  const email = `${name.toLowerCase().replace(/[^a-z -]/g, '').trim().split(/\s+/).join('.')}@${DEMO_EMAIL_DOMAIN}`;
  return { email, name, role, preferredUnits };
}

// Invented names (first and last names combined at random by hand; not real people).
const TRAINEE_NAMES = [
  'Aino Varga', 'Bram Okonjo', 'Carys Lindqvist', 'Dario Mensah', 'Elif Brannock', 'Femi Castellan',
  'Greta Nakashima', 'Hamza Oyelaran', 'Ines Fairweather', 'Jonas Abernethy', 'Kalani Restrepo', 'Luka Thorsby',
  'Maren Ekwueme', 'Nils Quaresma', 'Orla Szymanek', 'Pavel Adeyemi', 'Rhea Kallstrom', 'Soren Achterberg',
  'Tamsin Obradovic', 'Yusuf Penhallow',
] as const;

const DAY_MS = 86_400_000;

/** A working-day time within [startsOn, endsOn]: skips Saturdays and Sundays, 07:30–15:30 UTC. */
function recordedAtWithin(rng: Rng, startsOn: string, endsOn: string, fraction: number): string {
  const start = Date.parse(`${startsOn}T00:00:00Z`);
  const end = Date.parse(`${endsOn}T00:00:00Z`);
  const days = Math.round((end - start) / DAY_MS);
  let day = start + Math.min(days, Math.max(0, Math.floor(fraction * (days + 1)))) * DAY_MS;
  const weekday = new Date(day).getUTCDay();
  if (weekday === 6 || weekday === 0) {
    const monday = day + (weekday === 6 ? 2 : 1) * DAY_MS;
    day = monday <= end ? monday : day - (weekday === 6 ? 1 : 2) * DAY_MS;
  }
  const minutes = rng.int(7 * 60 + 30, 15 * 60 + 30);
  return new Date(day + minutes * 60_000).toISOString();
}

/**
 * Builds the invented demo data set for the fictional Brackwater Bolting School: users, a school
 * with two sites, three 2026 cohorts, two training joints, five methods, three lubricants and 152
 * simulated runs. Trainees improve over their attempts (their operator noise falls).
 *
 * @param seed seed of the whole scenario; each run's seed is drawn from it.
 */
export function buildDemoScenario(seed = 20261201): DemoScenario {
  const rng = createRng(seed);

  const admin = user('Sam Pellowe', 'admin', 'si');
  const instructors = [user('Marta Ilvesaar', 'instructor', 'si'), user('Kwame Duchesne', 'instructor', 'us')];
  const researcher = user('Lena Okoro-Strand', 'researcher', 'si');
  const trainees = TRAINEE_NAMES.map((name) => user(name, 'trainee', rng.next() < 0.25 ? 'us' : 'si'));
  const users = [admin, ...instructors, researcher, ...trainees];

  const school: DemoSchool = {
    key: 'brackwater',
    name: 'Brackwater Bolting School',
    sites: [
      { key: 'quay', name: 'Quay Street workshop', town: 'Brackwater' },
      { key: 'fenmoor', name: 'Fenmoor training hall', town: 'Fenmoor' },
    ],
  };

  const instructorOf = (i: number): DemoUser => instructors[i % instructors.length] as DemoUser;
  const cohortSpecs = [
    { key: 'spring-2026', name: 'Spring 2026 joint integrity', siteKey: 'quay', startsOn: '2026-02-02', endsOn: '2026-03-27', size: 7 },
    { key: 'summer-2026', name: 'Summer 2026 joint integrity', siteKey: 'fenmoor', startsOn: '2026-05-04', endsOn: '2026-06-26', size: 7 },
    { key: 'autumn-2026', name: 'Autumn 2026 joint integrity', siteKey: 'quay', startsOn: '2026-09-07', endsOn: '2026-10-30', size: 6 },
  ];
  let next = 0;
  const cohorts: DemoCohort[] = cohortSpecs.map((spec, i) => {
    const members = trainees.slice(next, next + spec.size).map((t) => t.email);
    next += spec.size;
    return {
      key: spec.key,
      name: spec.name,
      siteKey: spec.siteKey,
      startsOn: spec.startsOn,
      endsOn: spec.endsOn,
      instructorEmail: instructorOf(i).email,
      traineeEmails: members,
    };
  });

  const joints = [
    buildJoint(rng, 'nps4-cl150-8', 'Training flange A: NPS 4 Class 150-like, 8 studs', 'NPS 4', 'Class 150', 8, 0.625, 11, '5/8-11 UNC'),
    buildJoint(rng, 'nps6-cl300-12', 'Training flange B: NPS 6 Class 300-like, 12 studs', 'NPS 6', 'Class 300', 12, 0.75, 10, '3/4-10 UNC'),
  ];
  const methods = buildMethods(joints.map((j) => j.studCount));
  const lubricants = buildLubricants();

  const methodByKey = new Map(methods.map((m) => [m.key, m]));
  const lubricantByKey = new Map(lubricants.map((l) => [l.key, l]));

  // The curriculum: each trainee's attempts in this order of methods (teaching cases first).
  const curriculum = [
    'one-pass-circular-100',
    'one-pass-cross-100',
    'three-pass-cross-check',
    'three-pass-cross-check',
    'hydraulic-wrench-three-pass',
    'tensioner-two-pass',
    'three-pass-cross-check',
  ] as const;

  interface Plan {
    operator: DemoUser;
    cohort: DemoCohort;
    attempt: number;
    methodKey: string;
    lubricantKey: string;
    jointKey: string;
    operatorNoiseCv: number;
    recordedAt: string;
  }
  const plans: Plan[] = [];
  for (const cohort of cohorts) {
    for (const email of cohort.traineeEmails) {
      const operator = trainees.find((t) => t.email === email) as DemoUser;
      const skill = rng.uniform(0.8, 1.3); // invented: this trainee's steadiness, 1 = average
      curriculum.forEach((methodKey, a) => {
        const tool = methodByKey.get(methodKey)?.tool ?? 'manual_torque_wrench';
        // Invented learning curve: noise falls from ≈ 8.5 % to ≈ 3 % (× skill) over the attempts.
        const handNoise = skill * (0.025 + 0.06 * Math.exp(-a / 2));
        const noise = tool === 'manual_torque_wrench' ? handNoise : handNoise * 0.35;
        plans.push({
          operator,
          cohort,
          attempt: a + 1,
          methodKey,
          lubricantKey: a < 2 ? 'dry' : rng.pick(['dry', 'copper-paste', 'moly-paste']),
          jointKey: rng.pick(joints).key,
          operatorNoiseCv: Math.min(0.3, noise),
          recordedAt: recordedAtWithin(rng, cohort.startsOn, cohort.endsOn, (a + rng.uniform(0.1, 0.9)) / curriculum.length),
        });
      });
    }
  }
  // Instructors' demonstration runs: two per cohort they teach, plus one extra each.
  cohorts.forEach((cohort, i) => {
    const operator = instructorOf(i);
    for (const [d, methodKey] of ['one-pass-cross-100', 'three-pass-cross-check'].entries()) {
      plans.push({
        operator,
        cohort,
        attempt: 0,
        methodKey,
        lubricantKey: 'copper-paste',
        jointKey: rng.pick(joints).key,
        operatorNoiseCv: 0.02,
        recordedAt: recordedAtWithin(rng, cohort.startsOn, cohort.endsOn, d * 0.05),
      });
    }
  });
  for (const [i, operator] of instructors.entries()) {
    const cohort = cohorts[i] as DemoCohort;
    for (const methodKey of ['tensioner-two-pass', 'hydraulic-wrench-three-pass', 'one-pass-circular-100'] as const) {
      plans.push({
        operator,
        cohort,
        attempt: 0,
        methodKey,
        lubricantKey: 'moly-paste',
        jointKey: rng.pick(joints).key,
        operatorNoiseCv: 0.015,
        recordedAt: recordedAtWithin(rng, cohort.startsOn, cohort.endsOn, rng.uniform(0.2, 0.9)),
      });
    }
  }
  plans.sort((a, b) => (a.recordedAt < b.recordedAt ? -1 : a.recordedAt > b.recordedAt ? 1 : 0));

  // Instructors' attempts are numbered per instructor in time order.
  const attemptsSoFar = new Map<string, number>();
  const runs: DemoRun[] = plans.map((plan, index) => {
    const joint = joints.find((j) => j.key === plan.jointKey) as DemoJoint;
    const method = methodByKey.get(plan.methodKey) as DemoMethod;
    const lubricant = lubricantByKey.get(plan.lubricantKey) as DemoLubricant;
    const runSeed = rng.nextSeed();
    const { run, meta } = simulateLibraryRun({
      joint: { studCount: joint.studCount, targetLoadN: joint.targetLoadN, studDiameterM: studDiameterM({ threadSystem: 'inch', threadDiameter: joint.thread.diameter }) },
      method: methodForSim({ ...method, toolKind: method.tool }, joint.studCount),
      lubricant: lubricantForSim({ nominalNutFactor: lubricant.nominalK }),
      gasketStiffness: joint.simGasketStiffness,
      seed: runSeed,
      operatorNoiseCv: plan.operatorNoiseCv,
    });
    const source: DemoRunSource = rng.next() < 0.1 ? 'manual' : 'simulated';
    if (source === 'manual') for (const step of run.steps) step.timeS = null;
    const count = (attemptsSoFar.get(plan.operator.email) ?? 0) + 1;
    attemptsSoFar.set(plan.operator.email, count);
    return {
      key: `run-${String(index + 1).padStart(3, '0')}`,
      jointKey: joint.key,
      methodKey: method.key,
      lubricantKey: lubricant.key,
      operatorEmail: plan.operator.email,
      cohortKey: plan.cohort.key,
      attempt: plan.attempt > 0 ? plan.attempt : count,
      recordedAt: plan.recordedAt,
      source,
      status: 'complete',
      setAsideReason: null,
      run,
      simulation: meta,
    };
  });

  // Two runs set aside, with the reasons an instructor would write.
  const gaugeFault = runs.find((r, i) => i > 20 && r.status === 'complete' && r.run.studCount >= 8);
  if (gaugeFault) {
    gaugeFault.status = 'set_aside';
    gaugeFault.setAsideReason = 'Gauge on position 5 read zero throughout; broken lead found after the run.';
    for (const step of gaugeFault.run.steps) step.loadsN[4] = 0;
  }
  const wrongLube = runs.find((r, i) => i > 90 && r.status === 'complete' && r.lubricantKey === 'dry');
  if (wrongLube) {
    wrongLube.status = 'set_aside';
    wrongLube.setAsideReason = 'Paste found on two studs of a run logged as dry; kept for discussion only.';
  }

  return { notice: DEMO_NOTICE, seed, users, school, cohorts, joints, methods, lubricants, runs };
}

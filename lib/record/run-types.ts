/**
 * The normalised run: the one shape every way in (upload, grid, stream, simulator) produces and
 * every analysis consumes. Loads are in newtons; units are converted only at the edges.
 */
/**
 * One stud a step tightened, with the tool's load on it: a hydraulic tensioner step covers several
 * studs at once (every stud with 100 % tool coverage, every other one with 50 %). `appliedN` is the
 * peak while the tool is pressurised, `residualN` the load the stud keeps after the tool is
 * released (the same value as the step's `loadsN` at that position); applied ÷ residual is the
 * measured load transfer factor (lib/calc/tensioner-coverage.ts).
 */
export interface StepCover {
  position: number;
  appliedN: number;
  residualN: number;
}

export interface NormalisedStep {
  /** 1-based order of the step within the run. */
  order: number;
  /** 1-based pass number this step belongs to. */
  pass: number;
  /** Position (1..studCount, clockwise from 1) of the stud tightened in this step; for a step covering several studs, the first of them. */
  position: number;
  /** Every stud this step tightened with its applied and residual load (tensioner steps); absent for a one-stud torque step. */
  covers?: StepCover[] | null;
  /** Applied torque in N·m when the tool was a torque wrench and it was recorded. */
  appliedTorqueNm?: number | null;
  /** Applied hydraulic pressure in bar when a tensioner/hydraulic wrench was used and it was recorded. */
  appliedPressureBar?: number | null;
  /** Seconds since the start of the run, when known. */
  timeS?: number | null;
  /** Load of every stud right after this step, in N; index 0 is position 1. Length = studCount. */
  loadsN: number[];
}

export interface NormalisedRun {
  studCount: number;
  /** Target stud load in N. */
  targetLoadN: number;
  steps: NormalisedStep[];
}

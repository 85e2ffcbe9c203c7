import type { PassSummary } from '@/lib/analysis/types';
import { gasketStress, gasketStressLevel, type GasketStressLevel } from '@/lib/calc/gasket';
import type { GasketForStress } from '@/lib/joints/gasket-input';

export interface PassGasketStress {
  pass: number;
  /** Average gasket stress after the pass, MPa: every stud's load at the end of the pass summed ÷ contact area. */
  averageMpa: number;
  level: GasketStressLevel;
}

/** The classroom's gasket stress after each pass of one side's run, against the joint's seating and maximum stress. */
export function gasketStressByPass(passes: readonly PassSummary[], gasket: GasketForStress): PassGasketStress[] {
  const limits = { minSeatingMpa: gasket.minSeatingMpa, maxMpa: gasket.maxMpa };
  return passes.map((p) => {
    const averageMpa = gasketStress(p.loadsAfterN, gasket.areaMm2);
    return { pass: p.pass, averageMpa, level: gasketStressLevel(averageMpa, limits) };
  });
}

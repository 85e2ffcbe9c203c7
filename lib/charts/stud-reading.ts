import type { UnitSystem } from '@/lib/calc/units';
import { chartForceText, percentText } from './chart-format';

/** One stud's load against target, in the words and numbers every view uses. */
export interface StudReading {
  position: number;
  loadText: string;
  percentOfTarget: number;
  /** (load − target) / target × 100. */
  deviationPercent: number;
  percentOfTargetText: string;
  /** "3.0 % below", "2.1 % above" or "on target" (within ± 0.05 %). */
  deviationText: string;
  /** "Stud 3: 51.2 kN, 97.0 % of target, 3.0 % below". */
  sentence: string;
}

export function readStud(position: number, loadN: number, targetN: number, units: UnitSystem): StudReading {
  if (!Number.isFinite(loadN) || !Number.isFinite(targetN) || targetN <= 0) {
    return {
      position,
      loadText: '—',
      percentOfTarget: Number.NaN,
      deviationPercent: Number.NaN,
      percentOfTargetText: '—',
      deviationText: 'no reading',
      sentence: `Stud ${position}: no reading`,
    };
  }
  const percentOfTarget = (loadN / targetN) * 100;
  const deviationPercent = percentOfTarget - 100;
  const deviation = percentText(Math.abs(deviationPercent));
  const deviationText = deviation === percentText(0) ? 'on target' : `${deviation} ${deviationPercent < 0 ? 'below' : 'above'}`;
  const loadText = chartForceText(loadN, units);
  const percentOfTargetText = percentText(percentOfTarget);
  return {
    position,
    loadText,
    percentOfTarget,
    deviationPercent,
    percentOfTargetText,
    deviationText,
    sentence: `Stud ${position}: ${loadText}, ${percentOfTargetText} of target, ${deviationText}`,
  };
}

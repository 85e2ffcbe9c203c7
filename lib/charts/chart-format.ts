import { formatDecimals, formatNumber, formatPercentFixed, INPUT_UNIT, toInputUnit, UNIT_SPACE, type UnitSystem } from '@/lib/calc/units';

/** The force unit charts plot in: kN (SI) or lbf (US). */
export function forceUnit(units: UnitSystem): string {
  return INPUT_UNIT.force[units];
}

/** Newtons → the chart's force unit (kN or lbf). */
export function toChartForce(newtons: number, units: UnitSystem): number {
  return toInputUnit('force', newtons, units);
}

/** A force in the chart unit with the unit beside it, 3 significant figures: "51.2 kN", "11,510 lbf". */
export function chartForceText(newtons: number, units: UnitSystem): string {
  return `${formatNumber(toChartForce(newtons, units), 3)}${UNIT_SPACE}${forceUnit(units)}`;
}

/** A percentage with one decimal and the unit: "97.0 %"; signed on request: "+3.0 %", "−3.0 %" (lib/calc/units.ts). */
export const percentText = formatPercentFixed;

/** A pass's stated level: "60 %" (whole numbers without decimals, else one). */
export function passLevelText(percentOfTarget: number): string {
  return `${formatDecimals(percentOfTarget, 1, 0)}${UNIT_SPACE}%`;
}

/** "Pass 2 (60 %)", or "Pass 2" when the level is not known. */
export function passLabel(pass: number, percentOfTarget: number | null | undefined): string {
  return percentOfTarget == null ? `Pass ${pass}` : `Pass ${pass} (${passLevelText(percentOfTarget)})`;
}

/** A plain number for a table cell (3 significant figures), with a true minus sign. */
export function numberText(value: number, sig = 3): string {
  return formatNumber(value, sig).replace(/^-/, '−');
}

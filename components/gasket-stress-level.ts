import type { GasketStressLevel } from '@/lib/calc/gasket';
import { formatStress, type UnitSystem } from '@/lib/calc/units';
import type { GasketForStress } from '@/lib/joints/gasket-input';

/** Words and colour for where a gasket stress lies against the gasket's limits (report and classroom). */
export const LEVEL_TEXT: Record<GasketStressLevel, string> = { below_seating: 'below seating', within: 'within limits', above_max: 'above the maximum', unknown: '' };
export const LEVEL_CLASS: Record<GasketStressLevel, string> = { below_seating: 'text-caution', within: 'text-good', above_max: 'text-danger', unknown: 'text-muted' };

/** The sentence naming the gasket's limits in the user's units, with their source. */
export function gasketLimitsSentence(gasket: GasketForStress, units: UnitSystem): string {
  const limits = [gasket.minSeatingMpa === null ? null : `seating ${formatStress(gasket.minSeatingMpa, units)}`, gasket.maxMpa === null ? null : `maximum ${formatStress(gasket.maxMpa, units)}`].filter(Boolean).join(', ');
  return limits ? ` Limits: ${limits}${gasket.source ? ` (${gasket.source})` : ''}.` : ' No stress limits are set on this joint.';
}

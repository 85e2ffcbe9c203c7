/**
 * What the calculator's user typed, as one reducer, and the inputs `computeCalculator` gets from it.
 * Pure (no React), so the rules below hold wherever the state is kept.
 *
 * Unit-bearing fields keep both the text shown and the value in calculation units (`si`). A unit
 * switch rewrites the text from `si`, so switching back and forth never drifts; typing sets `si`
 * from the text. The nut bearing fields follow the stud size until the user edits one of them.
 */
import type { CalculatorInputs } from '@/lib/calc/calculate';
import type { GradeId } from '@/lib/calc/grades';
import { estimateNutBearing } from '@/lib/calc/nut-bearing';
import { NUT_FACTOR_SUGGESTIONS } from '@/lib/calc/nut-factors';
import type { LtfRule } from '@/lib/calc/tensioner';
import { STANDARD_THREADS, type ThreadSpec } from '@/lib/calc/thread';
import { formatInputValue, fromInputUnit, inToMm, toInputUnit, type Quantity, type UnitSystem } from '@/lib/calc/units';
import { parseNumberText } from '@/lib/format/parse-number';

/** A field whose unit depends on the unit system. */
export interface QuantityField {
  text: string;
  /** The value in calculation units (mm, mm², MPa); NaN when the text is not a number. */
  si: number;
}

export const quantityField = (quantity: Quantity, siValue: number, units: UnitSystem): QuantityField => ({
  text: formatInputValue(toInputUnit(quantity, siValue, units)),
  si: siValue,
});
const typed = (quantity: Quantity, text: string, units: UnitSystem): QuantityField => ({
  text,
  si: fromInputUnit(quantity, parseNumberText(text), units),
});
const switched = (quantity: Quantity, field: QuantityField, units: UnitSystem): QuantityField =>
  Number.isFinite(field.si) ? quantityField(quantity, field.si, units) : field;

/** The thread choice for a size that is not in the list. */
export const CUSTOM_THREAD = 'custom';
/** The nut factor choice for a K the user types. */
export const OWN_K = 'own';

export type LtfMode = LtfRule | 'custom';

export interface CalculatorState {
  units: UnitSystem;
  threadId: string;
  customSystem: 'inch' | 'metric';
  customInch: { diameter: string; tpi: string };
  customMetric: { diameter: string; pitch: string };
  grade: GradeId;
  targetKind: 'percentOfYield' | 'stress';
  percentText: string;
  stress: QuantityField;
  kChoice: string;
  kText: string;
  muThreadText: string;
  muBearingText: string;
  /** The bearing fields follow the stud size (`bearingOd`, `hole` hold the last own values). */
  bearingAuto: boolean;
  bearingOd: QuantityField;
  hole: QuantityField;
  ltfMode: LtfMode;
  clamp: QuantityField;
  ltfText: string;
  piston: QuantityField;
  /** Gasket section: contact diameters, stud count and the target gasket stress. */
  gasketInner: QuantityField;
  gasketOuter: QuantityField;
  gasketStress: QuantityField;
  gasketStudsText: string;
}

type TextField = 'percentText' | 'muThreadText' | 'muBearingText' | 'ltfText' | 'gasketStudsText';
type TypedQuantity = 'stress' | 'clamp' | 'piston' | 'gasketInner' | 'gasketOuter' | 'gasketStress';
const QUANTITY_OF: Record<TypedQuantity, Quantity> = { stress: 'stress', clamp: 'length', piston: 'area', gasketInner: 'length', gasketOuter: 'length', gasketStress: 'stress' };

export type CalculatorAction =
  | { type: 'units'; units: UnitSystem }
  | { type: 'thread'; threadId: string }
  | { type: 'choose'; patch: Partial<Pick<CalculatorState, 'customSystem' | 'grade' | 'targetKind' | 'ltfMode'>> }
  | { type: 'customInch'; patch: Partial<CalculatorState['customInch']> }
  | { type: 'customMetric'; patch: Partial<CalculatorState['customMetric']> }
  | { type: 'text'; field: TextField; text: string }
  | { type: 'quantity'; field: TypedQuantity; text: string }
  | { type: 'nutFactorChoice'; choice: string }
  | { type: 'nutFactor'; text: string }
  | { type: 'bearing'; which: 'od' | 'hole'; text: string }
  | { type: 'bearingAuto' };

const DEFAULT_THREAD = '3/4-10';
const defaultBearing = estimateNutBearing(inToMm(0.75));

/** The calculator as it opens. */
export function initialCalculatorState(): CalculatorState {
  return {
    units: 'si',
    threadId: DEFAULT_THREAD,
    customSystem: 'inch',
    customInch: { diameter: '0.75', tpi: '10' },
    customMetric: { diameter: '20', pitch: '2.5' },
    grade: 'A193-B7',
    targetKind: 'percentOfYield',
    percentText: '50',
    stress: quantityField('stress', 345, 'si'),
    kChoice: 'unknown',
    kText: '0.2',
    muThreadText: '0.15',
    muBearingText: '0.15',
    bearingAuto: true,
    bearingOd: quantityField('length', defaultBearing.bearingOdMm, 'si'),
    hole: quantityField('length', defaultBearing.holeDiameterMm, 'si'),
    ltfMode: 'tens1',
    clamp: quantityField('length', inToMm(3), 'si'),
    ltfText: '1.2',
    piston: { text: '', si: Number.NaN },
    // An example ring of 4.5 in × 5.5 in; 69 MPa is the seating stress of docs/REFERENCE.md §7 (a training default).
    gasketInner: quantityField('length', inToMm(4.5), 'si'),
    gasketOuter: quantityField('length', inToMm(5.5), 'si'),
    gasketStress: quantityField('stress', 69, 'si'),
    gasketStudsText: '8',
  };
}

/** The chosen standard thread, or the custom one from its fields. */
export function threadOf(s: CalculatorState): ThreadSpec {
  if (s.threadId !== CUSTOM_THREAD) {
    const std = STANDARD_THREADS.find((t) => t.id === s.threadId);
    if (std) return std.spec;
  }
  return s.customSystem === 'inch'
    ? { system: 'inch', diameterIn: parseNumberText(s.customInch.diameter), threadsPerInch: parseNumberText(s.customInch.tpi) }
    : { system: 'metric', diameterMm: parseNumberText(s.customMetric.diameter), pitchMm: parseNumberText(s.customMetric.pitch) };
}

/** The bearing fields as shown: while they follow the stud, the estimate for the current diameter. */
export function shownBearing(s: CalculatorState): { od: QuantityField; hole: QuantityField } {
  const thread = threadOf(s);
  const diameterMm = thread.system === 'inch' ? inToMm(thread.diameterIn) : thread.diameterMm;
  const auto = s.bearingAuto && Number.isFinite(diameterMm) && diameterMm > 0 ? estimateNutBearing(diameterMm) : null;
  return auto
    ? { od: quantityField('length', auto.bearingOdMm, s.units), hole: quantityField('length', auto.holeDiameterMm, s.units) }
    : { od: s.bearingOd, hole: s.hole };
}

/** What `computeCalculator` gets. */
export function calculatorInputs(s: CalculatorState): CalculatorInputs {
  const bearing = shownBearing(s);
  return {
    thread: threadOf(s),
    grade: s.grade,
    target: s.targetKind === 'percentOfYield' ? { kind: 'percentOfYield', percent: parseNumberText(s.percentText) } : { kind: 'stress', stressMpa: s.stress.si },
    nutFactor: parseNumberText(s.kText),
    longForm: {
      muThread: parseNumberText(s.muThreadText),
      muBearing: parseNumberText(s.muBearingText),
      bearingOdMm: bearing.od.si,
      holeDiameterMm: bearing.hole.si,
    },
    tensioner: {
      ltf: s.ltfMode === 'custom' ? { kind: 'custom', value: parseNumberText(s.ltfText) } : { kind: 'rule', rule: s.ltfMode, clampLengthMm: s.clamp.si },
      pistonAreaMm2: s.piston.text.trim() === '' ? null : s.piston.si,
    },
  };
}

function chooseThread(s: CalculatorState, threadId: string): CalculatorState {
  if (threadId !== CUSTOM_THREAD || s.threadId === CUSTOM_THREAD) return { ...s, threadId };
  // Start the custom fields from the thread that was chosen.
  const thread = threadOf(s);
  return thread.system === 'inch'
    ? { ...s, threadId, customSystem: 'inch', customInch: { diameter: String(thread.diameterIn), tpi: String(thread.threadsPerInch) } }
    : { ...s, threadId, customSystem: 'metric', customMetric: { diameter: String(thread.diameterMm), pitch: String(thread.pitchMm) } };
}

function editBearing(s: CalculatorState, which: 'od' | 'hole', text: string): CalculatorState {
  // The first edit freezes both fields at what they showed, then changes the one edited.
  const frozen = s.bearingAuto ? { ...s, bearingOd: shownBearing(s).od, hole: shownBearing(s).hole, bearingAuto: false } : s;
  const field = typed('length', text, s.units);
  return which === 'od' ? { ...frozen, bearingOd: field } : { ...frozen, hole: field };
}

export function calculatorReducer(s: CalculatorState, a: CalculatorAction): CalculatorState {
  switch (a.type) {
    case 'units':
      if (a.units === s.units) return s;
      return {
        ...s,
        units: a.units,
        stress: switched('stress', s.stress, a.units),
        bearingOd: switched('length', s.bearingOd, a.units),
        hole: switched('length', s.hole, a.units),
        clamp: switched('length', s.clamp, a.units),
        piston: switched('area', s.piston, a.units),
        gasketInner: switched('length', s.gasketInner, a.units),
        gasketOuter: switched('length', s.gasketOuter, a.units),
        gasketStress: switched('stress', s.gasketStress, a.units),
      };
    case 'thread':
      return chooseThread(s, a.threadId);
    case 'choose':
      return { ...s, ...a.patch };
    case 'customInch':
      return { ...s, customInch: { ...s.customInch, ...a.patch } };
    case 'customMetric':
      return { ...s, customMetric: { ...s.customMetric, ...a.patch } };
    case 'text':
      return { ...s, [a.field]: a.text };
    case 'quantity':
      return { ...s, [a.field]: typed(QUANTITY_OF[a.field], a.text, s.units) };
    case 'nutFactorChoice': {
      const suggestion = NUT_FACTOR_SUGGESTIONS.find((x) => x.id === a.choice);
      return { ...s, kChoice: a.choice, kText: suggestion ? String(suggestion.k) : s.kText };
    }
    case 'nutFactor':
      return { ...s, kText: a.text, kChoice: OWN_K };
    case 'bearing':
      return editBearing(s, a.which, a.text);
    case 'bearingAuto':
      return { ...s, bearingAuto: true };
  }
}

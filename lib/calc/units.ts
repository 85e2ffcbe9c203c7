/**
 * Unit conversions and number formatting for the whole app.
 *
 * Every calculation in `lib/calc` works in one coherent SI set: lengths in mm, areas in mm², forces
 * in N, stresses in MPa (= N/mm²), torques in N·m, pressures in MPa (shown as bar). US customary
 * values are converted only at the edges (input and display) with the factors below.
 *
 * Conversion factors and how each is derived:
 * - 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
 * - 1 lbf = 4.4482216152605 N exactly (1 lb = 0.45359237 kg exactly × standard gravity
 *   9.80665 m/s² exactly).
 * - 1 ft-lb (torque, pound-force foot) = 0.3048 m × 4.4482216152605 N = 1.3558179483314004 N·m
 *   exactly (the decimal product; the double nearest to it).
 * - 1 in² = 645.16 mm² exactly (25.4²).
 * - 1 psi = 4.4482216152605 N / 645.16 mm² = 0.006894757293168361 MPa, so 1 ksi =
 *   6.894757293168361 MPa (the quotient of two exact numbers, rounded to a double).
 * - 1 bar = 0.1 MPa exactly, so 1 bar = 0.1 / 0.006894757293168361 psi = 14.503773773020923 psi
 *   (computed from the exact factors above; not itself an exact decimal).
 *
 * Formatting: the `format*` helpers return a number string with its unit beside it, separated by a
 * no-break space (U+00A0) so a line never wraps between a number and its unit, e.g.
 * `formatForce(81_300, 'si')` → `"81.3 kN"`, `formatForce(81_313, 'us')` → `"18,280 lbf"`.
 * Numbers are rounded to a number of significant figures (defaults per quantity below), but whole
 * units are never rounded away (17,535 lbf stays `"17,535 lbf"` rather than `"17,500 lbf"`), and
 * trailing zeros that carry precision are kept, so columns of one quantity line up with
 * tabular figures (put the result in an element with class `num`).
 */

/** The two unit systems a user can choose. */
export type UnitSystem = 'si' | 'us';

/** mm per inch, exact. */
export const MM_PER_IN = 25.4;
/** N per lbf, exact. */
export const N_PER_LBF = 4.4482216152605;
/** N·m per ft-lb (0.3048 m × 4.4482216152605 N), exact decimal. */
export const NM_PER_FTLB = 1.3558179483314004;
/** mm² per in², exact (25.4²). */
export const MM2_PER_IN2 = 645.16;
/** MPa per ksi (1000 × 4.4482216152605 / 645.16). */
export const MPA_PER_KSI = 6.894757293168361;
/** MPa per psi. */
export const MPA_PER_PSI = MPA_PER_KSI / 1000;
/** MPa per bar, exact. */
export const MPA_PER_BAR = 0.1;
/** psi per bar, derived from the exact factors (0.1 MPa / MPA_PER_PSI); approximately 14.503773773. */
export const PSI_PER_BAR = MPA_PER_BAR / MPA_PER_PSI;

export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const lbfToN = (lbf: number): number => lbf * N_PER_LBF;
export const nToLbf = (newtons: number): number => newtons / N_PER_LBF;
export const ftLbToNm = (ftLb: number): number => ftLb * NM_PER_FTLB;
export const nmToFtLb = (nm: number): number => nm / NM_PER_FTLB;
export const in2ToMm2 = (in2: number): number => in2 * MM2_PER_IN2;
export const mm2ToIn2 = (mm2: number): number => mm2 / MM2_PER_IN2;
export const ksiToMpa = (ksi: number): number => ksi * MPA_PER_KSI;
export const mpaToKsi = (mpa: number): number => mpa / MPA_PER_KSI;
export const psiToMpa = (psi: number): number => psi * MPA_PER_PSI;
export const mpaToPsi = (mpa: number): number => mpa / MPA_PER_PSI;
export const barToMpa = (bar: number): number => bar * MPA_PER_BAR;
export const mpaToBar = (mpa: number): number => mpa / MPA_PER_BAR;
export const barToPsi = (bar: number): number => mpaToPsi(barToMpa(bar));
export const psiToBar = (psi: number): number => mpaToBar(psiToMpa(psi));

/** Quantities the app converts between systems; the SI unit is the one `lib/calc` computes in. */
export type Quantity = 'length' | 'area' | 'force' | 'stress' | 'torque' | 'pressure';

const TO_US: Record<Quantity, (si: number) => number> = {
  length: mmToIn,
  area: mm2ToIn2,
  force: nToLbf,
  stress: mpaToKsi,
  torque: nmToFtLb,
  pressure: mpaToPsi,
};
const FROM_US: Record<Quantity, (us: number) => number> = {
  length: inToMm,
  area: in2ToMm2,
  force: lbfToN,
  stress: ksiToMpa,
  torque: ftLbToNm,
  pressure: psiToMpa,
};

/** Unit label shown beside an input of a quantity in a system (for force in SI the base unit). */
export const INPUT_UNIT: Record<Quantity, Record<UnitSystem, string>> = {
  length: { si: 'mm', us: 'in' },
  area: { si: 'mm²', us: 'in²' },
  force: { si: 'kN', us: 'lbf' },
  stress: { si: 'MPa', us: 'ksi' },
  torque: { si: 'N·m', us: 'ft-lb' },
  pressure: { si: 'bar', us: 'psi' },
};

/**
 * Converts a value from the calculation unit (mm, mm², N, MPa, N·m, MPa) to the input unit of a
 * system (see `INPUT_UNIT`: note force inputs are kN in SI and pressure inputs are bar).
 */
export function toInputUnit(quantity: Quantity, siValue: number, system: UnitSystem): number {
  if (system === 'us') return TO_US[quantity](siValue);
  if (quantity === 'force') return siValue / 1000;
  if (quantity === 'pressure') return mpaToBar(siValue);
  return siValue;
}

/** Inverse of `toInputUnit`: a value typed in the input unit of a system → the calculation unit. */
export function fromInputUnit(quantity: Quantity, inputValue: number, system: UnitSystem): number {
  if (system === 'us') return FROM_US[quantity](inputValue);
  if (quantity === 'force') return inputValue * 1000;
  if (quantity === 'pressure') return barToMpa(inputValue);
  return inputValue;
}

/** Options for the `format*` helpers. */
export interface FormatOptions {
  /** Significant figures (whole units are never rounded away). */
  sig?: number;
}

/** The no-break space placed between a number and its unit. */
export const UNIT_SPACE = '\u00a0';

/**
 * Formats a plain number to `sig` significant figures with thousands separators, keeping every
 * whole unit: `formatNumber(17535.2, 3)` → `"17,535"`, `formatNumber(0.14187, 3)` → `"0.142"`,
 * `formatNumber(81.3, 3)` → `"81.3"`. Non-finite values give an em dash.
 */
export function formatNumber(value: number, sig = 3): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  let decimals = Math.max(0, sig - 1 - magnitude);
  // Rounding may carry into the next power of ten (0.09996 → 0.1000): recompute once.
  const rounded = Number(value.toFixed(Math.min(decimals, 20)));
  if (rounded !== 0) {
    const m2 = Math.floor(Math.log10(Math.abs(rounded)));
    if (m2 > magnitude) decimals = Math.max(0, sig - 1 - m2);
  }
  decimals = Math.min(decimals, 20);
  return new Intl.NumberFormat('en-US', {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
    useGrouping: true,
  }).format(value);
}

const withUnit = (num: string, unit: string): string => `${num}${UNIT_SPACE}${unit}`;

/**
 * A force given in newtons, as text with its unit. SI: N below 1 kN, kN below 1 MN, MN above
 * (`"81.3 kN"`). US: always lbf (`"18,280 lbf"`). Default 3 significant figures.
 */
export function formatForce(newtons: number, system: UnitSystem, options: FormatOptions = {}): string {
  const sig = options.sig ?? 3;
  if (system === 'us') return withUnit(formatNumber(nToLbf(newtons), sig), 'lbf');
  const abs = Math.abs(newtons);
  if (abs >= 1e6) return withUnit(formatNumber(newtons / 1e6, sig), 'MN');
  if (abs >= 1e3) return withUnit(formatNumber(newtons / 1e3, sig), 'kN');
  return withUnit(formatNumber(newtons, sig), 'N');
}

/** A torque given in N·m, as text with its unit: `"297 N·m"` or `"219 ft-lb"`. Default 3 significant figures. */
export function formatTorque(newtonMetres: number, system: UnitSystem, options: FormatOptions = {}): string {
  const sig = options.sig ?? 3;
  if (system === 'us') return withUnit(formatNumber(nmToFtLb(newtonMetres), sig), 'ft-lb');
  return withUnit(formatNumber(newtonMetres, sig), 'N·m');
}

/** A stress given in MPa, as text with its unit: `"724 MPa"` or `"105 ksi"`. Default 3 significant figures. */
export function formatStress(mpa: number, system: UnitSystem, options: FormatOptions = {}): string {
  const sig = options.sig ?? 3;
  if (system === 'us') return withUnit(formatNumber(mpaToKsi(mpa), sig), 'ksi');
  return withUnit(formatNumber(mpa, sig), 'MPa');
}

/** A pressure given in MPa, as text with its unit: `"1,030 bar"` or `"14,900 psi"`. Default 3 significant figures. */
export function formatPressure(mpa: number, system: UnitSystem, options: FormatOptions = {}): string {
  const sig = options.sig ?? 3;
  if (system === 'us') return withUnit(formatNumber(mpaToPsi(mpa), sig), 'psi');
  return withUnit(formatNumber(mpaToBar(mpa), sig), 'bar');
}

/** An area given in mm², as text with its unit: `"84.27 mm²"` or `"0.3345 in²"`. Default 4 significant figures. */
export function formatArea(mm2: number, system: UnitSystem, options: FormatOptions = {}): string {
  const sig = options.sig ?? 4;
  if (system === 'us') return withUnit(formatNumber(mm2ToIn2(mm2), sig), 'in²');
  return withUnit(formatNumber(mm2, sig), 'mm²');
}

/** A length given in mm, as text with its unit: `"19.05 mm"` or `"0.7500 in"`. Default 4 significant figures. */
export function formatLength(mm: number, system: UnitSystem, options: FormatOptions = {}): string {
  const sig = options.sig ?? 4;
  if (system === 'us') return withUnit(formatNumber(mmToIn(mm), sig), 'in');
  return withUnit(formatNumber(mm, sig), 'mm');
}

/** A percentage, as text with its sign: `"50.0 %"`. Default 3 significant figures. */
export function formatPercent(percent: number, options: FormatOptions = {}): string {
  return withUnit(formatNumber(percent, options.sig ?? 3), '%');
}

/**
 * A value for an editable input after a unit switch, or a plain number in a sentence: up to `sig`
 * (7) significant figures, trailing zeros and grouping removed (`"344.7379"`, `"50"`), so the text
 * stays short but faithful and reads back through lib/format/parse-number.ts.
 */
export function formatInputValue(value: number, sig = 7): string {
  if (!Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(sig)));
}

const decimalFormats = new Map<string, Intl.NumberFormat>();

/**
 * A number with at most `maxDecimals` and at least `minDecimals` (default: the same) decimals and
 * thousands separators (Intl.NumberFormat, en-US, rounding half away from zero):
 * `formatDecimals(1234.56, 1)` → `"1,234.6"`, `formatDecimals(24.8, 2, 0)` → `"24.8"`,
 * `formatDecimals(69.5, 0)` → `"70"`. Non-finite values give an em dash.
 */
export function formatDecimals(value: number, maxDecimals: number, minDecimals = maxDecimals): string {
  if (!Number.isFinite(value)) return '—';
  const key = `${minDecimals}-${maxDecimals}`;
  let format = decimalFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat('en-US', { minimumFractionDigits: minDecimals, maximumFractionDigits: maxDecimals, useGrouping: true });
    decimalFormats.set(key, format);
  }
  return format.format(value);
}

/**
 * A percentage with a fixed number of decimals (default 1), a true minus sign (U+2212) and, on
 * request, a plus sign; a value that rounds to zero has no sign: `"97.0 %"`, `"+3.0 %"`, `"−3.0 %"`.
 */
export function formatPercentFixed(percent: number, options: { signed?: boolean; decimals?: number } = {}): string {
  if (!Number.isFinite(percent)) return '—';
  const body = formatDecimals(Math.abs(percent), options.decimals ?? 1);
  const zero = !/[1-9]/.test(body);
  const sign = zero ? '' : percent < 0 ? '\u2212' : options.signed && percent > 0 ? '+' : '';
  return withUnit(`${sign}${body}`, '%');
}

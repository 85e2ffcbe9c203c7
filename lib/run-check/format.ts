import { formatDecimals, formatInputValue, formatPercent } from '../calc/units';

/** A load for a check message, in kN with up to 1 decimal. */
export const kn = (n: number): string => `${formatDecimals(n / 1000, 1, 0)} kN`;

/** A percentage for a check message, 3 significant figures. */
export const percent = (p: number): string => formatPercent(p, { sig: 3 });

/** "1 pass", "4 passes". */
export const count = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

/** A setting as it was typed (a band of 10 %, not 10.0 %). */
export const plainPercent = (p: number): string => `${formatInputValue(p, 6)} %`;

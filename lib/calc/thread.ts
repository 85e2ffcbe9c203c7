import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import { in2ToMm2, inToMm, MM_PER_IN } from './units';

/**
 * Thread geometry for studs: tensile stress area, root (minor-diameter) area, pitch diameter, and
 * the list of standard threads the calculator offers.
 *
 * All results are in mm / mm² whatever the thread system, so every other calculation has one set
 * of units; inch-native helpers (`inchTensileStressAreaIn2`, `inchRootAreaIn2`) are kept for
 * checking against inch tables.
 *
 * References (sources listed in docs/REFERENCE.md §10):
 * - [EE-B1.1] ASME B1.1 tensile stress area As = 0.7854 (D − 0.9743/n)².
 * - [TRIB] ISO 898-1 As = (π/4)((d2 + d3)/2)², d2 = d − 0.649519P, d3 = d − 1.226869P; the inch
 *   offsets 0.6495/n (pitch diameter) and 1.2990/n (minor diameter), whose mean is 0.9743/n.
 * - [TME], [FAST] root areas 0.1257 / 0.202 / 0.302 / 0.551 in² for 1/2-13, 5/8-11, 3/4-10, 1-8.
 * - [CFR46], [TME] flange studs of 1 in and larger use the 8UN series.
 */

/** An inch (unified) or metric (ISO) thread. */
export type ThreadSpec =
  | { system: 'inch'; diameterIn: number; threadsPerInch: number }
  | { system: 'metric'; diameterMm: number; pitchMm: number };

/**
 * zod schema for a thread spec, with the limits the calculator accepts and messages written as
 * sentences for the field they are about. The limits are the calculator's working range (common
 * practice for flange studs and a little beyond), not limits of the standards.
 */
export const threadSpecSchema = z.discriminatedUnion('system', [
  z.object({
    system: z.literal('inch'),
    diameterIn: z
      .number({ error: 'Enter the stud diameter in inches as a number.' })
      .min(0.25, { error: 'Stud diameter must be between 0.25 in and 4 in.' })
      .max(4, { error: 'Stud diameter must be between 0.25 in and 4 in.' }),
    threadsPerInch: z
      .number({ error: 'Enter the threads per inch as a number.' })
      .min(4, { error: 'Threads per inch must be between 4 and 40.' })
      .max(40, { error: 'Threads per inch must be between 4 and 40.' }),
  }),
  z.object({
    system: z.literal('metric'),
    diameterMm: z
      .number({ error: 'Enter the stud diameter in millimetres as a number.' })
      .min(6, { error: 'Stud diameter must be between 6 mm and 100 mm.' })
      .max(100, { error: 'Stud diameter must be between 6 mm and 100 mm.' }),
    pitchMm: z
      .number({ error: 'Enter the pitch in millimetres as a number.' })
      .min(0.5, { error: 'Pitch must be between 0.5 mm and 6 mm.' })
      .max(6, { error: 'Pitch must be between 0.5 mm and 6 mm.' }),
  }),
]);

/** Geometry of one thread, all in mm and mm². */
export interface ThreadGeometry {
  /** Nominal (major) diameter, mm. */
  diameterMm: number;
  /** Pitch, mm (25.4 / threads per inch for inch threads). */
  pitchMm: number;
  /** Basic pitch diameter d2, mm. */
  pitchDiameterMm: number;
  /** Minor diameter used for the root area, mm (see `rootAreaMm2`). */
  minorDiameterMm: number;
  /** Tensile stress area As, mm². */
  tensileStressAreaMm2: number;
  /** Root (minor-diameter) area, mm². */
  rootAreaMm2: number;
}

/**
 * Tensile stress area of a unified inch thread, in in²: As = 0.7854 (D − 0.9743/n)².
 * Source: ASME B1.1 as given by [EE-B1.1].
 * @example inchTensileStressAreaIn2(0.75, 10) // 0.3345 in² (table 0.334 [EE-AREA])
 */
export function inchTensileStressAreaIn2(diameterIn: number, threadsPerInch: number): number {
  return 0.7854 * (diameterIn - 0.9743 / threadsPerInch) ** 2;
}

/**
 * Root (minor-diameter) area of a unified inch external thread, in in²:
 * A_root = 0.7854 (D − 1.2990/n)².
 *
 * The offset 1.2990/n (= 1.5 × 0.866025/n, i.e. 1.5 H of the sharp-V height H) is the
 * minor-diameter offset that, averaged with the pitch-diameter offset 0.6495/n, gives B1.1's
 * 0.9743/n ([TRIB], docs/REFERENCE.md §1). We chose it because it reproduces the root-area tables to
 * their printed digits: 0.1257 (1/2-13), 0.202 (5/8-11), 0.302 (3/4-10) [TME] and 0.551 (1-8)
 * [FAST]. That these tables were built from exactly this diameter (rather than a B1.1 UNR
 * minor-diameter limit such as D − 1.19078/n, which gives larger areas) is our inference
 * (from memory, unverified); the agreement is checked in tests.
 */
export function inchRootAreaIn2(diameterIn: number, threadsPerInch: number): number {
  return 0.7854 * (diameterIn - 1.299 / threadsPerInch) ** 2;
}

/**
 * Tensile stress area of an ISO metric thread, in mm²: As = (π/4)((d2 + d3)/2)² with
 * d2 = d − 0.649519P and d3 = d − 1.226869P. Source: ISO 898-1 as given by [TRIB].
 * @example metricTensileStressAreaMm2(20, 2.5) // 244.8 mm² (ISO 898-1 table 245 [ISO898])
 */
export function metricTensileStressAreaMm2(diameterMm: number, pitchMm: number): number {
  const d2 = diameterMm - 0.649519 * pitchMm;
  const d3 = diameterMm - 1.226869 * pitchMm;
  return (Math.PI / 4) * ((d2 + d3) / 2) ** 2;
}

/**
 * Root area of an ISO metric external thread at d3 = d − 1.226869P, in mm² ([TRIB]).
 */
export function metricRootAreaMm2(diameterMm: number, pitchMm: number): number {
  const d3 = diameterMm - 1.226869 * pitchMm;
  return (Math.PI / 4) * d3 ** 2;
}

/**
 * Checks a thread spec and returns its geometry in mm and mm².
 * Inch threads: d2 = D − 0.6495/n, minor diameter D − 1.2990/n ([TRIB]), areas as above.
 * Metric threads: d2 = d − 0.649519P, d3 = d − 1.226869P ([TRIB]).
 * @throws AppError `invalid_input` when the spec is outside `threadSpecSchema`, naming the field.
 */
export function threadGeometry(spec: ThreadSpec): ThreadGeometry {
  const parsed = threadSpecSchema.safeParse(spec);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new AppError('invalid_input', issue?.message ?? 'The thread is not valid.', {
      field: issue?.path.join('.'),
    });
  }
  const s = parsed.data;
  if (s.system === 'inch') {
    const n = s.threadsPerInch;
    const D = s.diameterIn;
    return {
      diameterMm: inToMm(D),
      pitchMm: MM_PER_IN / n,
      pitchDiameterMm: inToMm(D - 0.6495 / n),
      minorDiameterMm: inToMm(D - 1.299 / n),
      tensileStressAreaMm2: in2ToMm2(inchTensileStressAreaIn2(D, n)),
      rootAreaMm2: in2ToMm2(inchRootAreaIn2(D, n)),
    };
  }
  const d = s.diameterMm;
  const P = s.pitchMm;
  return {
    diameterMm: d,
    pitchMm: P,
    pitchDiameterMm: d - 0.649519 * P,
    minorDiameterMm: d - 1.226869 * P,
    tensileStressAreaMm2: metricTensileStressAreaMm2(d, P),
    rootAreaMm2: metricRootAreaMm2(d, P),
  };
}

/** Nominal diameter of a thread spec in mm. */
export function nominalDiameterMm(spec: ThreadSpec): number {
  return spec.system === 'inch' ? inToMm(spec.diameterIn) : spec.diameterMm;
}

/** One of the standard threads offered in pickers. */
export interface StandardThread {
  /** Stable id, e.g. `"3/4-10"`, `"1-1/8-8"`, `"M20"`. */
  id: string;
  /** Label as the trade writes it, e.g. `"3/4-10 UNC"`, `"1-1/8-8 UN"`, `"M20 × 2.5"`. */
  label: string;
  spec: ThreadSpec;
  /** Where the size-and-pitch pairing comes from. */
  source: string;
}

const inch = (id: string, D: number, n: number, series: 'UNC' | 'UN', source: string): StandardThread => ({
  id,
  label: `${id} ${series}`,
  spec: { system: 'inch', diameterIn: D, threadsPerInch: n },
  source,
});
const metric = (d: number, P: number, source: string): StandardThread => ({
  id: `M${d}`,
  label: `M${d} × ${P}`,
  spec: { system: 'metric', diameterMm: d, pitchMm: P },
  source,
});

// Sources shown on screen name the standard; how far each was checked (docs/REFERENCE.md §1, §10):
// UNC areas ✓ [EE-AREA]; 8UN for flange studs of 1 in and larger ✓ [CFR46], [TME]; metric sizes as
// tabulated in ISO 898-1 ✓ [ISO898]; the M42 and M48 coarse pitches are from memory, unverified
// (the ISO 898-1 table stops at M39).
const UNC = 'ASME B1.1, coarse series (UNC)';
const UN8 = 'ASME B1.1, 8-thread series (8UN), used for flange studs of 1 in and larger';
const ISO = 'ISO 261/262 coarse pitch; stress areas as tabulated in ISO 898-1';
const ISO_MEM = 'ISO 261 coarse pitch';

/**
 * Standard thread choices: 1/2-13 to 1-8 UNC, 1-1/8-8 to 2-8 UN, M12 to M36 coarse, and M42/M48
 * with coarse pitches from memory (unverified).
 */
export const STANDARD_THREADS: readonly StandardThread[] = [
  inch('1/2-13', 0.5, 13, 'UNC', UNC),
  inch('5/8-11', 0.625, 11, 'UNC', UNC),
  inch('3/4-10', 0.75, 10, 'UNC', UNC),
  inch('7/8-9', 0.875, 9, 'UNC', UNC),
  inch('1-8', 1, 8, 'UNC', UNC),
  inch('1-1/8-8', 1.125, 8, 'UN', UN8),
  inch('1-1/4-8', 1.25, 8, 'UN', UN8),
  inch('1-3/8-8', 1.375, 8, 'UN', UN8),
  inch('1-1/2-8', 1.5, 8, 'UN', UN8),
  inch('1-5/8-8', 1.625, 8, 'UN', UN8),
  inch('1-3/4-8', 1.75, 8, 'UN', UN8),
  inch('2-8', 2, 8, 'UN', UN8),
  metric(12, 1.75, ISO),
  metric(16, 2, ISO),
  metric(20, 2.5, ISO),
  metric(24, 3, ISO),
  metric(27, 3, ISO),
  metric(30, 3.5, ISO),
  metric(33, 3.5, ISO),
  metric(36, 4, ISO),
  metric(42, 4.5, ISO_MEM),
  metric(48, 5, ISO_MEM),
];

/**
 * The standard thread with this id.
 * @throws AppError `invalid_input` for an unknown id.
 */
export function standardThread(id: string): StandardThread {
  const found = STANDARD_THREADS.find((t) => t.id === id);
  if (!found) throw new AppError('invalid_input', `There is no standard thread "${id}" in the list.`, { field: 'thread' });
  return found;
}

/** A short label for any thread spec: `"3/4-10"`-style ids for standard ones, else `"0.8 in - 9 TPI"` / `"M22 × 2.5"`. */
export function threadLabel(spec: ThreadSpec): string {
  const std = STANDARD_THREADS.find(
    (t) =>
      t.spec.system === spec.system &&
      (spec.system === 'inch'
        ? t.spec.system === 'inch' && t.spec.diameterIn === spec.diameterIn && t.spec.threadsPerInch === spec.threadsPerInch
        : t.spec.system === 'metric' && t.spec.diameterMm === spec.diameterMm && t.spec.pitchMm === spec.pitchMm),
  );
  if (std) return std.label;
  return spec.system === 'inch' ? `${spec.diameterIn} in – ${spec.threadsPerInch} TPI` : `M${spec.diameterMm} × ${spec.pitchMm}`;
}

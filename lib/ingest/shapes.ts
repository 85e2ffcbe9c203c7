/**
 * The three generic table shapes we import, and a first guess at the column mapping from the
 * header names. The guess is our own heuristic; the upload screen shows it for the user to confirm
 * or correct, then sends the confirmed mapping back (validated with {@link columnMappingSchema}).
 *
 * - **wide**: one row per scan; a time column, one load column per stud, optionally a step/event
 *   and/or pass column (and a tightened-position column).
 * - **long**: one row per reading; time, stud position and load (optionally step/pass markers).
 * - **step_table**: one row per reading after each step; pass, step, stud position, load, and
 *   optionally applied torque or pressure, tightened position and time (our CSV export is one).
 */
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import { LOAD_UNITS, TORQUE_UNITS, type LoadUnit, type TorqueUnit } from './units';
import { valueInEitherConvention } from './numbers';
import { quoteInput } from './text-limits';
import { channelOfHeader, headerTokens, looksLikeGaugeName, roleOfHeader, studPositionOfHeader, UNIT_KEYS, type HeaderRole as Role } from './header-words';
import { positionOfChannel, type ChannelMap } from './channel-map';

export { headerTokens, studPositionOfHeader } from './header-words';

/** The table shapes we import. */
export const SHAPES = ['wide', 'long', 'step_table'] as const;
/** A table shape. */
export type Shape = (typeof SHAPES)[number];

const column = z.string().trim().min(1);

/**
 * Zod schema of a column mapping. Column references are header names exactly as in the file
 * (trimmed). `tightenedColumn` (the stud the tool was on) is our addition to the brief's field
 * list; it is optional and, when absent, the tightened stud is inferred from the loads.
 */
export const columnMappingSchema = z
  .object({
    shape: z.enum(SHAPES),
    timeColumn: column.nullable(),
    studColumns: z.array(z.object({ column, position: z.number().int().min(1) })),
    positionColumn: column.nullable(),
    loadColumn: column.nullable(),
    stepColumn: column.nullable(),
    passColumn: column.nullable(),
    torqueColumn: column.nullable(),
    pressureColumn: column.nullable(),
    tightenedColumn: column.nullable().default(null),
    /** Zero offsets: `auto` removes them when the file starts at rest with small offsets (readers/zero.ts); `off` keeps them. */
    tare: z.enum(['auto', 'off']).default('auto'),
    /** The sheet of an .xlsx workbook to read (`workbook.ts`); absent = the first sheet. */
    sheet: z.string().trim().min(1).max(100).optional(),
    loadUnit: z.enum(LOAD_UNITS),
    torqueUnit: z.enum(TORQUE_UNITS),
  })
  .superRefine((m, ctx) => {
    const need = (field: keyof typeof m, why: string) => {
      if (m[field] === null) ctx.addIssue({ code: 'custom', path: [field], message: why });
    };
    if (m.shape === 'wide' && m.studColumns.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['studColumns'], message: 'A wide table needs one load column per stud.' });
    }
    if (m.shape === 'long') {
      need('timeColumn', 'A long table needs a time column.');
      need('positionColumn', 'A long table needs a stud position column.');
      need('loadColumn', 'A long table needs a load column.');
    }
    if (m.shape === 'step_table') {
      need('stepColumn', 'A step table needs a step column.');
      need('positionColumn', 'A step table needs a stud position column.');
      need('loadColumn', 'A step table needs a load column.');
    }
  });

/** A column mapping: which header holds what, and the units of loads and torques. */
export type ColumnMapping = z.output<typeof columnMappingSchema>;

/** A proposed mapping with the reasons behind its guesses, for the confirmation screen. */
export interface MappingProposal {
  mapping: ColumnMapping;
  /** e.g. `Load unit kN taken from "Stud 1 [kN]".` or `No unit in the headers; assumed kN ...`. */
  notes: string[];
  /** False when part of the guess rests on an assumption (a unit from the size of values, unknown gauge names, ...): the user must confirm it. */
  certain: boolean;
}

/** What the guess may use besides the header: the joint's channel map and stud count, metadata lines above the header. */
export interface ProposalContext {
  channelMap?: ChannelMap;
  studCount?: number;
  metadata?: ReadonlyArray<{ line: number; key: string; value: string }>;
}

/** The load unit a header names (`[kN]`, `(lbf)`, `_kip`, `ue`, `µε`, `microstrain`, `N`), or null. */
export function loadUnitOfHeader(header: string): LoadUnit | null {
  const lower = header.toLowerCase();
  if (/µε|με|µe|microstrain|µstrain|ustrain/u.test(lower)) return 'microstrain';
  const tokens = headerTokens(header);
  if (tokens.includes('ue')) return 'microstrain';
  if (tokens.includes('kip') || tokens.includes('kips')) return 'kip';
  if (tokens.includes('lbf') || tokens.includes('lb') || tokens.includes('lbs')) return 'lbf';
  if (tokens.includes('kn')) return 'kN';
  if (tokens.includes('n')) return 'N';
  return null;
}

/** The torque unit a header names (`ft-lb`, `ft·lbf`, `lb-ft`, `N·m`, `Nm`), or null. */
export function torqueUnitOfHeader(header: string): TorqueUnit | null {
  const lower = header.toLowerCase();
  if (/ft[\s\-·.]*lbf?|lbf?[\s\-·.]*ft/.test(lower)) return 'ft-lb';
  if (/n[\s\-·.]*m(?![a-z])/.test(lower)) return 'N·m';
  return null;
}


/**
 * Proposes a mapping from the header and a few data rows, with notes on each guess.
 *
 * Shape: two or more stud load columns → wide. Otherwise a position and a load column → step table
 * when there is a step column and no position repeats within one step in the sample, else long
 * (which needs a time column). Load unit: from the first header that names one; failing that, kN
 * when every sampled load is below 2000, else N (a guess the notes flag). Torque unit from the
 * torque header, N·m by default.
 *
 * @param headerLine the header's line number, used in error messages.
 * @throws AppError('invalid_input') when no shape fits the headers.
 */
export function proposeMappingWithNotes(headers: readonly string[], sampleRows: readonly (readonly string[])[], headerLine = 1, context: ProposalContext = {}): MappingProposal {
  const notes: string[] = [];
  let certain = true;
  const first: Partial<Record<Role, string>> = {};
  const studColumns: ColumnMapping['studColumns'] = [];
  const channels: string[] = [];
  const gauges: string[] = [];
  headers.forEach((raw) => {
    const h = raw.trim();
    const role = roleOfHeader(h);
    const byName = role === 'torque' || role === 'pressure' || role === 'tightened';
    const pos = byName ? null : studPositionOfHeader(h);
    if (pos !== null) {
      studColumns.push({ column: h, position: pos });
      return;
    }
    if (!byName && channelOfHeader(h)) {
      channels.push(h);
      return;
    }
    if (role !== 'ignore' && first[role] === undefined) first[role] = h;
    else if (role === 'ignore' && looksLikeGaugeName(h)) gauges.push(h);
  });
  if (channels.length > 0) certain = addChannelColumns(channels, context.channelMap, studColumns, notes) && certain;
  if (studColumns.length < 2 && first.position === undefined) certain = addGaugeColumns(gauges, sampleRows, headers, context.channelMap, studColumns, notes) && certain;
  if (context.studCount !== undefined && studColumns.length >= 2 && studColumns.length !== context.studCount) {
    notes.push(`The file has ${studColumns.length} load columns; the joint has ${context.studCount} studs. Check which column is which stud.`);
    certain = false;
  }
  const col = (r: Role): string | null => first[r] ?? null;
  const index = (name: string | null) => (name === null ? -1 : headers.findIndex((h) => h.trim() === name));

  let shape: Shape;
  if (studColumns.length >= 2) shape = 'wide';
  else if (col('position') !== null && col('load') !== null) {
    const stepIdx = index(col('step'));
    const posIdx = index(col('position'));
    const passIdx = index(col('pass'));
    let repeats = false;
    if (stepIdx >= 0) {
      const seen = new Set<string>();
      let key = '';
      for (const row of sampleRows) {
        const k = `${passIdx >= 0 ? row[passIdx] : ''}\u0000${row[stepIdx] ?? ''}`;
        if (k !== key) {
          key = k;
          seen.clear();
        }
        const p = (row[posIdx] ?? '').trim();
        if (seen.has(p)) repeats = true;
        seen.add(p);
      }
    }
    shape = stepIdx >= 0 && !repeats ? 'step_table' : 'long';
    if (shape === 'long' && col('time') === null) {
      throw new AppError(
        'invalid_input',
        `Line ${headerLine}, column ${quoteInput(col('position') ?? '')}: the columns look like one reading per row (stud position here, load in ${quoteInput(col('load') ?? '')}) but there is no time or step column to group them.`,
        { row: headerLine, column: col('position') ?? undefined },
      );
    }
  } else {
    throw new AppError(
      'invalid_input',
      `Line ${headerLine}: could not recognise the columns (${headers.slice(0, 10).map((h) => quoteInput(h)).join(', ')}${headers.length > 10 ? ` and ${headers.length - 10} more` : ''}). Name the stud load columns "Stud 1", "Stud 2", ... (wide), or give "position" and "load" columns (long or step table).`,
      { row: headerLine },
    );
  }

  const loadHeaders = shape === 'wide' ? studColumns.map((s) => s.column) : [col('load')!];
  let loadUnit: LoadUnit | null = null;
  for (const h of loadHeaders) {
    loadUnit = loadUnitOfHeader(h);
    if (loadUnit) {
      notes.push(`Load unit ${loadUnit} taken from ${quoteInput(h)}.`);
      break;
    }
  }
  if (!loadUnit) {
    const meta = unitFromMetadata(context.metadata ?? []);
    if (meta) {
      loadUnit = meta.unit;
      notes.push(`Load unit ${meta.unit} taken from line ${meta.line} (${quoteInput(meta.text)}).`);
    }
  }
  if (!loadUnit) {
    const idx = loadHeaders.map((h) => index(h));
    let max = 0;
    for (const row of sampleRows)
      for (const i of idx) {
        const value = valueInEitherConvention(row[i] ?? '');
        if (value !== null) max = Math.max(max, Math.abs(value));
      }
    loadUnit = max < 2000 ? 'kN' : 'N';
    certain = false;
    notes.push(`No load unit in the headers; assumed ${loadUnit} from the size of the values (largest ${max}). Check it.`);
  }
  const torqueColumn = col('torque');
  const torqueUnit = (torqueColumn && torqueUnitOfHeader(torqueColumn)) || 'N·m';
  if (torqueColumn) notes.push(`Torque unit ${torqueUnit}${torqueUnitOfHeader(torqueColumn) ? ` taken from ${quoteInput(torqueColumn)}` : ' assumed (no unit in the header)'}.`);

  const mapping: ColumnMapping = {
    shape,
    timeColumn: col('time'),
    studColumns: shape === 'wide' ? studColumns : [],
    positionColumn: shape === 'wide' ? null : col('position'),
    loadColumn: shape === 'wide' ? null : col('load'),
    stepColumn: col('step'),
    passColumn: col('pass'),
    torqueColumn,
    pressureColumn: col('pressure'),
    tightenedColumn: col('tightened'),
    loadUnit,
    torqueUnit,
    tare: 'auto',
  };
  notes.unshift(`Shape: ${shape === 'step_table' ? 'step table' : shape}.`);
  return { mapping, notes, certain };
}

/**
 * Proposes a column mapping from the header and sample rows; see {@link proposeMappingWithNotes}
 * for the rules (this returns only the mapping).
 */
export function proposeMapping(headers: readonly string[], sampleRows: readonly (readonly string[])[], headerLine = 1): ColumnMapping {
  return proposeMappingWithNotes(headers, sampleRows, headerLine).mapping;
}

/**
 * Channel-named load columns (CH1, AI0, ...) through the joint's channel map. AI/AIN numbers count
 * from 0 when the file has an AI0 (the usual numbering of analogue inputs); AI columns starting at 1
 * are taken as counted from 1, a guess the notes flag. Returns whether the guess is certain.
 */
function addChannelColumns(channels: readonly string[], map: ChannelMap | undefined, out: ColumnMapping['studColumns'], notes: string[]): boolean {
  const ai = channels.map((h) => channelOfHeader(h)!).filter((c) => c.analogueInput);
  const zeroBased = ai.length === 0 || ai.some((c) => c.number === 0);
  let certain = true;
  if (ai.length > 0 && !zeroBased) {
    notes.push('The analogue-input columns start at 1, not 0; taken as AI1 = stud 1. Check it.');
    certain = false;
  }
  const taken = new Set(out.map((s) => s.position));
  for (const h of channels) {
    const position = positionOfChannel(h, map, zeroBased);
    if (position === null || position < 1 || taken.has(position)) {
      certain = false;
      continue;
    }
    taken.add(position);
    out.push({ column: h, position });
  }
  out.sort((a, b) => a.position - b.position);
  notes.push(map && map.length > 0 ? "Channel columns placed by the joint's channel map." : `Channel columns placed as channel k = stud k${ai.length > 0 ? ' (AI0 = stud 1)' : ''}; the joint has no channel map of its own.`);
  return certain;
}

/**
 * Gauge or serial names (`SG-1041`) with numbers below them: placed by the joint's channel map, or
 * else in column order, a guess the notes flag. Returns whether the guess is certain.
 */
function addGaugeColumns(
  gauges: readonly string[],
  sampleRows: readonly (readonly string[])[],
  headers: readonly string[],
  map: ChannelMap | undefined,
  out: ColumnMapping['studColumns'],
  notes: string[],
): boolean {
  const numeric = gauges.filter((g) => {
    const i = headers.findIndex((h) => h.trim() === g);
    return sampleRows.length > 0 && sampleRows.every((r) => valueInEitherConvention(r[i] ?? '') !== null);
  });
  if (numeric.length < 2) return true;
  const mapped = numeric.map((g) => ({ column: g, position: positionOfChannel(g, map) }));
  if (mapped.every((m) => m.position !== null)) {
    out.push(...mapped.map((m) => ({ column: m.column, position: m.position! })));
    notes.push("Gauge columns placed by the joint's channel map.");
    return true;
  }
  out.push(...numeric.map((g, k) => ({ column: g, position: k + 1 })));
  notes.push(`Columns ${numeric.map((g) => quoteInput(g)).join(', ')} taken as studs 1 to ${numeric.length} in the order they appear; the joint's channel map does not name them. Check which column is which stud.`);
  return false;
}

/** A load unit named on a metadata line above the header (`units: lbf`, `Einheit: kN`, `Unité = kN`). */
function unitFromMetadata(metadata: ReadonlyArray<{ line: number; key: string; value: string }>): { unit: LoadUnit; line: number; text: string } | null {
  for (const m of metadata) {
    const key = headerTokens(m.key).join(' ');
    if (!UNIT_KEYS.includes(key)) continue;
    const unit = loadUnitOfHeader(m.value);
    if (unit) return { unit, line: m.line, text: `${m.key}: ${m.value}` };
  }
  return null;
}

/** Finding the mapped columns in the header and checking the mapping fits the file shape. */
import { AppError } from '@/lib/http/errors';
import type { ColumnMapping } from '../shapes';
import { cellError } from './cells';

/** Column indexes of the mapped roles; -1 where the role is not mapped. */
export interface ColumnIndexes {
  time: number;
  step: number;
  pass: number;
  torque: number;
  pressure: number;
  tightened: number;
  /** Long and step-table shapes only. */
  position: number;
  /** Long and step-table shapes only. */
  load: number;
}

/**
 * The index of the header column named `name` (trimmed), or -1 for `null`.
 *
 * @throws AppError('invalid_input') when the header has no such column or more than one.
 */
export function columnIndex(names: readonly string[], name: string | null, headerLine: number): number {
  if (name === null) return -1;
  const at: number[] = [];
  names.forEach((h, i) => {
    if (h === name.trim()) at.push(i);
  });
  if (at.length === 0) throw cellError(headerLine, name, 'the mapping names this column but the header has no such column.');
  if (at.length > 1) throw cellError(headerLine, name, `the header has ${at.length} columns with this name (columns ${at.map((i) => i + 1).join(' and ')}); rename one.`);
  return at[0]!;
}

/**
 * Resolves every mapped role to its column and checks the shape's required columns: a position
 * and a load column for long and step tables, a time column for long, a step column for step tables.
 *
 * @throws AppError('invalid_input') for a missing, duplicate or required-but-unmapped column.
 */
export function resolveColumns(names: readonly string[], mapping: ColumnMapping, headerLine: number): ColumnIndexes {
  const at = (name: string | null) => columnIndex(names, name, headerLine);
  const shape = mapping.shape;
  const columns: ColumnIndexes = {
    time: at(mapping.timeColumn),
    step: at(mapping.stepColumn),
    pass: at(mapping.passColumn),
    torque: at(mapping.torqueColumn),
    pressure: at(mapping.pressureColumn),
    tightened: at(mapping.tightenedColumn),
    position: shape === 'wide' ? -1 : at(mapping.positionColumn),
    load: shape === 'wide' ? -1 : at(mapping.loadColumn),
  };
  if (shape !== 'wide' && (columns.position < 0 || columns.load < 0)) {
    throw new AppError('invalid_input', `A ${shape === 'long' ? 'long table' : 'step table'} needs a position column and a load column.`, { field: 'mapping' });
  }
  if (shape === 'long' && columns.time < 0) throw new AppError('invalid_input', 'A long table needs a time column.', { field: 'timeColumn' });
  if (shape === 'step_table' && columns.step < 0) throw new AppError('invalid_input', 'A step table needs a step column.', { field: 'stepColumn' });
  return columns;
}

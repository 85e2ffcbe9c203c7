import { lbfToN } from '@/lib/calc/units';
import type { JointInput } from '@/lib/joints/joint-input';
import { NO_GASKET_DATA } from '@/lib/joints/gasket-input';

/** A 4-stud 5/8-11 B7 joint (invented), every factor 1. */
export const fourStudJoint = (name: string, gasketType = 'spiral-wound'): JointInput => ({
  name, nominalSize: 'NPS 4', pressureClass: 'Class 150', studCount: 4,
  thread: { system: 'inch', diameterIn: 0.625, threadsPerInch: 11 }, studGrade: 'A193-B7', nutGrade: null,
  washer: null, gasketType, gasket: NO_GASKET_DATA, bandPercent: 10, targetLoadN: lbfToN(11_865), notes: null,
  positions: Array.from({ length: 4 }, (_, i) => ({ position: i + 1, calibrationFactor: 1, note: null })),
});

/** A calibration table (the documented layout) whose gauge p reads load/k[p] with a ±0.02 kN wobble, so every interval has a width. */
export function tableFor(k: number[]): string {
  const levels = [20, 40, 60, 80];
  const wobble = (i: number) => (i % 2 === 0 ? 0.02 : -0.02);
  const row = (dir: string, load: number, i: number) => [dir, load, ...k.map((f) => (load === 0 ? 0 : load / f + wobble(i)))].join(',');
  return [
    ['direction', 'load_cell_kN', ...k.map((_, i) => `p${i + 1}`)].join(','),
    ...levels.map((l, i) => row('up', l, i)),
    ...[...levels].reverse().map((l, i) => row('down', l, i + 1)),
    row('down', 0, 0),
  ].join('\n');
}

/** A session on `performedOn` against load cell certificate LC-7 (in date), table from {@link tableFor}. */
export const calibrationSession = (performedOn: string, k: number[]) => ({
  performedOn, dueOn: '', loadCellCertificate: 'LC-7', loadCellCertifiedOn: '2026-01-10', loadCellDueOn: '2027-01-10', table: tableFor(k),
});

/**
 * A small generator of live logger lines in our own generic delimited layout (time in seconds, then
 * one field per channel, loads in kN), for the browser's Connect logger tests. Invented tightening:
 * the studs are pulled one at a time in the given order, each in two readings up to its load for
 * the pass and then held for seven readings, 0.1 s apart; untouched studs hold their load.
 */

export interface TighteningPlan {
  /** Stud positions in the order they are pulled in every pass. */
  order: readonly number[];
  /** Per pass, the load in kN each position is brought to (index 0 = position 1). */
  passesKn: ReadonlyArray<readonly number[]>;
  /** The logger channel (1-based field after the time) that carries each position. */
  channelOfPosition: (position: number) => number;
  delimiter: string;
  decimalComma: boolean;
}

/** The lines (without line ends) of one invented tightening, starting with three readings at rest. */
export function tighteningLines(plan: TighteningPlan): string[] {
  const studs = plan.passesKn[0]!.length;
  const loads = new Array<number>(studs).fill(0);
  const lines: string[] = [];
  let tenths = 0;
  const write = () => {
    const byChannel = new Array<string>(studs);
    loads.forEach((kn, i) => (byChannel[plan.channelOfPosition(i + 1) - 1] = kn.toFixed(2)));
    const fields = [(tenths / 10).toFixed(1), ...byChannel];
    lines.push(fields.map((f) => (plan.decimalComma ? f.replace('.', ',') : f)).join(plan.delimiter));
    tenths++;
  };
  for (let i = 0; i < 3; i++) write();
  for (const pass of plan.passesKn) {
    for (const position of plan.order) {
      const from = loads[position - 1]!;
      const to = pass[position - 1]!;
      loads[position - 1] = (from + to) / 2;
      write();
      loads[position - 1] = to;
      for (let i = 0; i < 8; i++) write();
    }
  }
  return lines;
}

/**
 * The one error type the simulator throws for bad input. Messages follow one grammar:
 * `<function> requires <what was expected>` (e.g. `simulateRun requires a positive targetLoadN`).
 */
export class SimInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SimInputError';
  }
}

/** The method's % of target per pass, check passes (circular, 100 %) appended. */
export function passPercentsOf(method: { passes: readonly { percentOfTarget: number }[]; checkPasses: number }): number[] {
  return [...method.passes.map((p) => p.percentOfTarget), ...Array.from({ length: method.checkPasses }, () => 100)];
}

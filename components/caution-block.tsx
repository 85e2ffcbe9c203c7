/**
 * The short caution block the calculator, the joint form and the classroom carry (PRODUCT.md,
 * "Cautions"). Wording is ours; the points follow docs/REFERENCE.md §8 (governing statement, hydraulic
 * tools, pinch points), all marked there as common practice.
 *
 * A server-safe component (no hooks), so it renders in server and client trees alike.
 */

export type CautionVariant = 'calculator' | 'joint' | 'classroom' | 'calibration' | 'tensioner';

const VARIANT_LINE: Record<CautionVariant, string> = {
  calculator:
    'Check every result against the stud, flange and gasket limits in the approved procedure before using it; a lower nut factor than assumed over-loads the studs.',
  joint: 'A training joint is not a plant joint: its settings teach the method and are not values for equipment in service.',
  calibration:
    "Calibrate instruments by their owner's procedures and against a reference in date; these figures check a training rig's gauges and are not a calibration certificate.",
  tensioner:
    "Hydraulic tensioners work at high pressure: follow the tool maker's instructions for pressure, stroke and fit, keep hoses and couplings in good order, stay clear of the tool and out of line with the stud while it is pressurised; the owner's procedures and qualified judgement decide the loads and the sequence.",
  classroom:
    'The rig studs are loaded: keep hands clear of the reaction arm and the flange gap, and stay out of line with the studs while a tool is working.',
};

/** The caution shown wherever gasket stress is (the run report, the classroom). */
export const GASKET_STRESS_CAUTION = "Going past the gasket's maximum stress crushes it. Follow the gasket maker's data, the owner's procedures and qualified engineering judgement.";

export interface CautionBlockProps {
  /** Adds the line for the place the block is shown. Without it, only the common lines. */
  variant?: CautionVariant;
  className?: string;
}

export function CautionBlock({ variant, className = '' }: CautionBlockProps) {
  return (
    <aside
      aria-label="Caution"
      className={`rounded-card border border-rule border-l-4 border-l-caution bg-panel px-4 py-3 text-sm text-ink ${className}`}
    >
      <p className="font-semibold text-caution">Caution</p>
      <ul className="mt-1 list-disc space-y-1 pl-5">
        <li>These values are for training and study.</li>
        <li>The approved procedure, local codes and qualified engineering judgement govern every real joint.</li>
        <li>Hydraulic tools and pressurised systems can injure: use rated equipment and isolate the system first.</li>
        {variant ? <li>{VARIANT_LINE[variant]}</li> : null}
      </ul>
    </aside>
  );
}

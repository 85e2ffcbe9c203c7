import { GASKET_STRESS_CAUTION } from '@/components/caution-block';
import { gasketLimitsSentence, LEVEL_CLASS, LEVEL_TEXT } from '@/components/gasket-stress-level';
import { formatStress, type UnitSystem } from '@/lib/calc/units';
import { gasketStressByPass } from '@/lib/classroom/gasket-passes';
import type { BuiltScene } from './scene-model';

/**
 * The scene's gasket stress: per side, the average after each pass (total stud load ÷ contact
 * area) against the joint's seating and maximum stress, in the user's units. Nothing without a
 * gasket contact area on the joint.
 */
export function GasketPassStress({ scene, units }: { scene: BuiltScene; units: UnitSystem }) {
  const gasket = scene.gasket;
  if (!gasket || scene.sides.length === 0) return null;
  const sides = scene.sides.map((side) => ({ key: side.key, label: side.label, byPass: gasketStressByPass(side.analysis.passes, gasket) }));
  const passCount = Math.max(...sides.map((s) => s.byPass.length));
  const stress = (mpa: number) => formatStress(mpa, units);
  return (
    <section aria-labelledby="gasket-pass-heading" className="space-y-2" data-testid="classroom-gasket">
      <h2 id="gasket-pass-heading" className="text-2xl font-semibold">Gasket stress after each pass</h2>
      <p className="text-lg text-muted">
        Average = total stud load ÷ gasket contact area.{gasketLimitsSentence(gasket, units)}
      </p>
      <table className="num w-full border-collapse text-left">
        <thead>
          <tr className="border-b-2 border-ink text-xl">
            <th scope="col" className="py-1 pr-4 font-medium text-muted">After pass</th>
            {sides.map((s) => <th key={s.key} scope="col" className="py-1 pr-4 text-right font-semibold">{s.label}</th>)}
          </tr>
        </thead>
        <tbody>
          {Array.from({ length: passCount }, (_, i) => (
            <tr key={i} className="border-b border-rule">
              <th scope="row" className="py-1 pr-4 text-xl font-medium">Pass {i + 1}</th>
              {sides.map((s) => {
                const p = s.byPass[i];
                return (
                  <td key={s.key} className="whitespace-nowrap py-1 pr-4 text-right text-2xl font-semibold">
                    {p ? <>{stress(p.averageMpa)} {p.level === 'unknown' ? null : <span className={`text-base ${LEVEL_CLASS[p.level]}`}>{LEVEL_TEXT[p.level]}</span>}</> : '—'}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-base text-muted">{GASKET_STRESS_CAUTION}</p>
    </section>
  );
}

import { describe, expect, it } from 'vitest';
import { gasketStress } from '@/lib/calc/gasket';
import { gasketAreaOf } from '@/lib/joints/gasket-input';
import { buildDemoScenario } from '@/lib/demo/demo-scenario';
import { demoGasketOf } from '@/lib/demo/demo-library';

// The demo joints' gasket (invented contact rings with the training limits) must be plausible: at the
// demo target every stud's load over the contact area lands between the seating stress and the maximum.
// Expected averages worked by hand in psi from ASME B1.1 tensile stress areas (5/8-11: 0.2260 in²,
// 3/4-10: 0.3345 in²), 52,500 psi on them, and π/4 (Do² − Di²): flange A ≈ 10,110 psi = 69.7 MPa,
// flange B ≈ 10,920 psi = 75.3 MPa (computed).
describe('the demo joints’ gasket', () => {
  const joints = buildDemoScenario().joints;

  it('gives every demo joint a contact ring and the training limits labelled as such', () => {
    for (const joint of joints) {
      const gasket = demoGasketOf(joint.key);
      expect(gasket, joint.key).not.toBeNull();
      expect(gasket!.outerMm).toBeGreaterThan(gasket!.innerMm);
      // ASME VIII-1 App. 2 y for spiral-wound, non-asbestos filled: 10,000 psi = 69 MPa (docs/REFERENCE.md §7).
      expect(gasket).toMatchObject({ minSeatingMpa: 69, maxMpa: 207, source: 'training default: set your own' });
    }
    expect(demoGasketOf('no-such-joint')).toBeNull();
  });

  it('puts the average gasket stress at the demo target between seating and the maximum', () => {
    const expectedMpa: Record<string, number> = { 'nps4-cl150-8': 69.7, 'nps6-cl300-12': 75.3 };
    for (const joint of joints) {
      const gasket = demoGasketOf(joint.key)!;
      const stress = gasketStress(Array.from({ length: joint.studCount }, () => joint.targetLoadN), gasketAreaOf({ ...gasket, areaMm2: null })!);
      expect(stress, joint.key).toBeCloseTo(expectedMpa[joint.key]!, 0);
      expect(stress).toBeGreaterThanOrEqual(gasket.minSeatingMpa);
      expect(stress).toBeLessThan(gasket.maxMpa);
    }
  });
});

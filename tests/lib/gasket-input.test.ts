import { describe, expect, it } from 'vitest';
import { inToMm, ksiToMpa } from '@/lib/calc/units';
import { gasketAreaOf, gasketFormValues, parseGasketFields, TRAINING_DEFAULT_SOURCE } from '@/lib/joints/gasket-input';

describe('the joint form gasket fields', () => {
  it('reads SI values as typed and leaves empty fields null', () => {
    const r = parseGasketFields({ gasketInner: '100', gasketOuter: '150', gasketMinSeating: '69', gasketMax: '207', gasketStressSource: 'maker data sheet', flangeFacing: 'Raised face' }, 'si');
    expect(r.errors).toEqual({});
    expect(r.value).toMatchObject({ innerMm: 100, outerMm: 150, areaMm2: null, minSeatingMpa: 69, maxMpa: 207, clampLengthMm: null, flangeFacing: 'Raised face' });
    // π/4 (150² − 100²) = 3125π = 9,817.477 mm² (area of an annulus, by hand)
    expect(gasketAreaOf(r.value)).toBeCloseTo(9817.477, 3);
  });

  it('converts US input: inches to mm (×25.4, exact) and ksi to MPa (×6.894757)', () => {
    const r = parseGasketFields({ gasketInner: '4.5', gasketOuter: '5.5', gasketMinSeating: '10', clampLength: '3', gasketStressSource: 'procedure 12' }, 'us');
    expect(r.errors).toEqual({});
    expect(r.value.innerMm).toBeCloseTo(inToMm(4.5), 12);
    expect(r.value.clampLengthMm).toBeCloseTo(76.2, 12);
    expect(r.value.minSeatingMpa).toBeCloseTo(ksiToMpa(10), 12);
  });

  it('asks for both diameters, a maximum above seating and a source for the limits', () => {
    const r = parseGasketFields({ gasketInner: '100', gasketMinSeating: '100', gasketMax: '50' }, 'si');
    expect(r.errors.gasketOuter?.[0]).toBe('Enter both contact diameters, or neither (and the area instead).');
    expect(r.errors.gasketMax?.[0]).toBe('The maximum stress must be above the minimum seating stress.');
    expect(r.errors.gasketStressSource?.[0]).toMatch(/^Say where the stress limits come from/);
  });

  it('refuses an outer diameter under the inner, text, and a facing not on the list', () => {
    const r = parseGasketFields({ gasketInner: '150', gasketOuter: '100', gasketArea: 'abc', flangeFacing: 'Serrated' }, 'si');
    expect(r.errors.gasketOuter?.[0]).toBe('The outer contact diameter must be larger than the inner.');
    expect(r.errors.gasketArea?.[0]).toBe('Enter the contact area as a number more than zero, or leave it empty.');
    expect(r.errors.flangeFacing?.[0]).toBe('Choose a flange facing from the list.');
  });

  it('starts a new joint from the training defaults, labelled as such, in the form units', () => {
    const si = gasketFormValues(null, 'si');
    expect(si.gasketMinSeating).toBe('69');
    expect(si.gasketStressSource).toBe(TRAINING_DEFAULT_SOURCE);
    // 69 MPa / 6.894757 = 10.00760 ksi (docs/REFERENCE.md §7: y = 10,000 psi ≈ 69 MPa)
    expect(Number(gasketFormValues(null, 'us').gasketMinSeating)).toBeCloseTo(10.0076, 4);
  });

  it('uses a stored area when there are no diameters', () => {
    expect(gasketAreaOf({ innerMm: null, outerMm: null, areaMm2: 5000 })).toBe(5000);
    expect(gasketAreaOf({ innerMm: null, outerMm: null, areaMm2: null })).toBeNull();
  });
});

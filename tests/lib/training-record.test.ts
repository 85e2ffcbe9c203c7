import { describe, expect, it } from 'vitest';
import { addMonths, recordStatus } from '@/lib/qualification/training-record';
import { DEFAULT_CHECKLIST, listFromLines, outstandingItems, theoryPassed } from '@/lib/qualification/course-outcome';
import { formatVerificationCode, newVerificationCode, normaliseVerificationCode } from '@/lib/qualification/verification-code';

describe('verification codes', () => {
  it('are 16 characters of Crockford base32 (no I, L, O, U) and differ each time', () => {
    // Alphabet: Douglas Crockford, "Base32 Encoding" (crockford.com/base32.html).
    const codes = Array.from({ length: 200 }, () => newVerificationCode());
    for (const code of codes) expect(code).toMatch(/^[0-9A-HJKMNP-TV-Z]{16}$/);
    expect(new Set(codes).size).toBe(codes.length);
  });

  it('reads typed codes leniently as Crockford prescribes (case, hyphens, O→0, I/L→1) and refuses the rest', () => {
    expect(normaliseVerificationCode('abcd-efgh-jkmn-pqrs')).toBe('ABCDEFGHJKMNPQRS');
    expect(normaliseVerificationCode('O0IL 1234 5678 9ABC')).toBe('0011123456789ABC');
    expect(normaliseVerificationCode('ABCD-EFGH-JKMN-PQRU')).toBeNull();
    expect(normaliseVerificationCode('ABCD')).toBeNull();
    expect(normaliseVerificationCode("' OR 1=1 --")).toBeNull();
    expect(formatVerificationCode('ABCDEFGHJKMNPQRS')).toBe('ABCD-EFGH-JKMN-PQRS');
  });
});

describe('validity and status', () => {
  it('adds calendar months, falling back to the month’s last day (computed by hand)', () => {
    expect(addMonths('2026-12-03', 36)).toBe('2029-12-03');
    expect(addMonths('2027-01-31', 1)).toBe('2027-02-28');
    expect(addMonths('2027-12-31', 2)).toBe('2028-02-29');
  });

  it('is valid through its last day, then expired; revoked and replaced win over both', () => {
    const record = { revokedAt: null, replacedById: null, validUntil: '2029-12-03' };
    expect(recordStatus(record, '2029-12-03')).toBe('valid');
    expect(recordStatus(record, '2029-12-04')).toBe('expired');
    expect(recordStatus({ ...record, revokedAt: '2027-01-01T00:00:00Z' }, '2027-01-02')).toBe('revoked');
    expect(recordStatus({ ...record, revokedAt: '2027-01-01T00:00:00Z', replacedById: 9 }, '2030-01-01')).toBe('replaced');
  });
});

describe('what a pass needs beside the decision', () => {
  const observedAll = DEFAULT_CHECKLIST.map((label) => ({ label, observed: true }));
  const evidence = { attemptsMet: 1, theoryScore: 70, theoryPassMark: 70, checklist: observedAll };
  it('nothing is outstanding with a met attempt, the theory result exactly at the pass mark and every item observed', () => {
    // The rule stated in lib/qualification/course-outcome.ts: score >= mark passes.
    expect(theoryPassed(70, 70)).toBe(true);
    expect(theoryPassed(69.9, 70)).toBe(false);
    expect(outstandingItems(evidence)).toEqual([]);
  });
  it('names each thing that is outstanding', () => {
    expect(outstandingItems({ ...evidence, theoryScore: null })).toEqual(['No theory result entered.']);
    expect(outstandingItems({ ...evidence, theoryScore: 69.5 })[0]).toBe('The theory result (69.5 %) is below the pass mark (70 %).');
    expect(outstandingItems({ ...evidence, attemptsMet: 0 })).toEqual(['No signed-off assessed attempt meets every criterion.']);
    expect(outstandingItems({ ...evidence, checklist: [] })).toEqual(['The cohort has no observation checklist yet.']);
    const someMissing = observedAll.map((item) => ({ ...item, observed: item.label === 'Lubrication' }));
    expect(outstandingItems({ ...evidence, checklist: someMissing })).toEqual([`Not yet observed: Surface and thread preparation, Gasket placement, Tool check, Keeping clear of the tool's line of action.`]);
  });

  it('reads lists from lines', () => {
    expect(listFromLines(' Hand torque \n\nTensioning\nHand  torque\n')).toEqual(['Hand torque', 'Tensioning']);
  });
});

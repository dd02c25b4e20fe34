import { wardRequirement } from './ward';

const mix = (low: number, medium: number, high: number) => ({ low, medium, high });

describe('ward requirement: patients / ratio rounded up, with the trade floor', () => {
  it('California Title 22 CCR 70217, medical/surgical 1:5 at all times: 28 patients need 6 nurses', () => {
    // ratio from PRODUCT.md trade facts; 28 / 5 = 5.6 -> 6 (rounding up: a ratio is a maximum load)
    const r = wardRequirement(mix(28, 0, 0), { patientsPerStaff: mix(5, 5, 5), minimumPerShift: 0 });
    expect(r).toEqual({ byRatio: 6, floor: 0, required: 6 });
  });

  it('exactly 25 patients at 1:5 need 5, not 6', () => {
    expect(
      wardRequirement(mix(0, 25, 0), { patientsPerStaff: mix(5, 5, 5), minimumPerShift: 0 }).required,
    ).toBe(5);
  });

  it('NICE SG1 red flag: never fewer than 2 registered nurses, even for 3 patients', () => {
    // floor from PRODUCT.md trade facts (NICE SG1, 2014: fewer than 2 RNs on a shift is a red flag)
    const r = wardRequirement(mix(3, 0, 0), { patientsPerStaff: mix(8, 8, 8), minimumPerShift: 2 });
    expect(r).toEqual({ byRatio: 1, floor: 2, required: 2 });
  });

  it('an acuity mix adds each level at its own ratio: 10 at 1:5, 4 at 1:4, 2 intensive at 1:2 -> 4', () => {
    // Title 22 ratios per kind of care (med/surg 1:5, telemetry 1:4, intensive care 1:2): 2 + 1 + 1
    const r = wardRequirement(mix(10, 4, 2), { patientsPerStaff: mix(5, 4, 2), minimumPerShift: 2 });
    expect(r.byRatio).toBe(4);
    expect(r.required).toBe(4);
  });

  it('a fraction of a person rounds up: 11 at 1:5 and 1 at 1:2 -> 2.2 + 0.5 = 2.7 -> 3', () => {
    expect(
      wardRequirement(mix(11, 0, 1), { patientsPerStaff: mix(5, 4, 2), minimumPerShift: 0 }).byRatio,
    ).toBe(3);
  });

  it('no patients: the floor alone', () => {
    expect(
      wardRequirement(mix(0, 0, 0), { patientsPerStaff: mix(8, 5, 2), minimumPerShift: 2 }).required,
    ).toBe(2);
  });

  it('rejects a ratio of 0 or negative patients', () => {
    expect(() =>
      wardRequirement(mix(1, 0, 0), { patientsPerStaff: mix(0, 5, 2), minimumPerShift: 0 }),
    ).toThrow(RangeError);
    expect(() =>
      wardRequirement(mix(-1, 0, 0), { patientsPerStaff: mix(5, 5, 2), minimumPerShift: 0 }),
    ).toThrow(RangeError);
  });
});

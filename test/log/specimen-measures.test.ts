import { describe, expect, it } from 'vitest';
import { specimenMeasuresDiffer, type SpecimenMeasures } from '../../src/log';

describe('whether a specimen’s measured values changed', () => {
  const typed: SpecimenMeasures = { mass_kg: 0.0581, u_mass_kg: 0.0001, shape: { kind: 'sphere', diameter_m: 0.067, u_diameter_m: 0.0005 } };
  // The same shape as an imported file holds it: keys in sorted order.
  const imported: SpecimenMeasures = { u_mass_kg: 0.0001, mass_kg: 0.0581, shape: { diameter_m: 0.067, kind: 'sphere', u_diameter_m: 0.0005 } as SpecimenMeasures['shape'] };

  it('is no for the same values with their fields in another order (a rename of an imported specimen)', () => {
    expect(JSON.stringify(typed.shape)).not.toBe(JSON.stringify(imported.shape));
    expect(specimenMeasuresDiffer(typed, imported)).toBe(false);
  });

  it('is yes for a changed dimension, mass or uncertainty', () => {
    expect(specimenMeasuresDiffer(typed, { ...imported, shape: { ...imported.shape, diameter_m: 0.068 } as SpecimenMeasures['shape'] })).toBe(true);
    expect(specimenMeasuresDiffer(typed, { ...imported, mass_kg: 0.0582 })).toBe(true);
    expect(specimenMeasuresDiffer(typed, { ...imported, u_mass_kg: 0.0002 })).toBe(true);
  });
});

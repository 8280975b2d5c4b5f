import { canonicalJson } from './canonical';
import type { SpecimenBody } from './types';

/** What a specimen's measured values are: its shape with its dimensions, and its mass, each with its uncertainty. */
export type SpecimenMeasures = Pick<SpecimenBody, 'shape' | 'mass_kg' | 'u_mass_kg'>;

/**
 * Whether two versions of a specimen differ in a measured value (a change that needs a reason). Compared by
 * value, not by how the fields happen to be ordered: a specimen read from a file has its keys in the file's
 * (sorted) order, one typed on the phone in the form's order, and renaming either must not ask why its
 * measurements changed.
 */
export function specimenMeasuresDiffer(a: SpecimenMeasures, b: SpecimenMeasures): boolean {
  return a.mass_kg !== b.mass_kg || a.u_mass_kg !== b.u_mass_kg || canonicalJson(a.shape) !== canonicalJson(b.shape);
}

/**
 * Shapes a crew can log, and what the fall model needs from each: frontal area, volume, the
 * length used in the Reynolds number, the length along the fall, and the default added-mass
 * coefficient. Orientation is fixed by the shape: a cylinder falls axis vertical, a disc flat,
 * a box with its length × width face down.
 */
import { equivalentSpheroidAddedMassCoefficient } from './addedMassCoefficient';
import { checkNumber, checkOptionalNumber } from './checkNumber';
import { PhysicsInputError } from './physicsInputError';

interface SpecimenCommon {
  mass_kg: number;
  /** A drag coefficient known beforehand (a handbook value, an earlier test); used for predictions. */
  reference_drag_coefficient?: number;
}
export interface SphereSpecimen extends SpecimenCommon {
  shape: 'sphere';
  diameter_m: number;
}
/** Axis vertical: falls end first. */
export interface CylinderSpecimen extends SpecimenCommon {
  shape: 'cylinder';
  diameter_m: number;
  length_m: number;
}
/** Falls flat. */
export interface DiscSpecimen extends SpecimenCommon {
  shape: 'disc';
  diameter_m: number;
  thickness_m: number;
}
/** Falls with its length × width face down; thickness is the vertical extent. */
export interface BoxSpecimen extends SpecimenCommon {
  shape: 'box';
  length_m: number;
  width_m: number;
  thickness_m: number;
}
/** Anything else, described by its frontal area and volume. */
export interface CustomSpecimen extends SpecimenCommon {
  shape: 'custom';
  area_m2: number;
  volume_m3: number;
  /** For the Reynolds number; defaults to the diameter of a circle of the frontal area. */
  characteristic_length_m?: number;
}
export type SpecimenInput = SphereSpecimen | CylinderSpecimen | DiscSpecimen | BoxSpecimen | CustomSpecimen;
export type SpecimenShape = SpecimenInput['shape'];

/** The dimension fields of each shape, in a fixed order (also the names of their uncertainties). */
export const SHAPE_DIMENSIONS = {
  sphere: ['diameter_m'],
  cylinder: ['diameter_m', 'length_m'],
  disc: ['diameter_m', 'thickness_m'],
  box: ['length_m', 'width_m', 'thickness_m'],
  custom: ['area_m2', 'volume_m3'],
} as const satisfies Record<SpecimenShape, readonly string[]>;

export const SPECIMEN_LIMITS = {
  mass_kg: { min: 0, minExclusive: true, max: 20_000, text: 'above 0 and at most 20 000 kg' },
  length: { min: 0, minExclusive: true, max: 10, text: 'above 0 and at most 10 m' },
  area_m2: { min: 0, minExclusive: true, max: 100, text: 'above 0 and at most 100 m²' },
  volume_m3: { min: 0, max: 100, text: '0 to 100 m³' },
  reference_drag_coefficient: { min: 0, minExclusive: true, max: 100, text: 'above 0 and at most 100' },
} as const;

export interface SpecimenGeometry {
  shape: SpecimenShape;
  area_m2: number;
  volume_m3: number;
  /** Reynolds-number length: the diameter, or the frontal area's equivalent diameter. */
  characteristic_length_m: number;
  /** Extent along the fall (null for a custom shape). */
  length_along_fall_m: number | null;
  /** Potential-flow estimate (see addedMassCoefficient.ts); 0 for a custom shape. */
  default_added_mass_coefficient: number;
}

/** Geometry from a shape and its dimensions in SHAPE_DIMENSIONS order (used for perturbed inputs too). */
export function geometryFromDimensions(
  shape: SpecimenShape,
  dims: ArrayLike<number>,
  characteristicLength?: number,
): SpecimenGeometry {
  const out = geometryScratch;
  writeGeometry(shape, dims, characteristicLength, out);
  return {
    shape,
    area_m2: out[GEOMETRY_AREA]!,
    volume_m3: out[GEOMETRY_VOLUME]!,
    characteristic_length_m: out[GEOMETRY_LENGTH]!,
    length_along_fall_m: shape === 'custom' ? null : out[GEOMETRY_ALONG_FALL]!,
    default_added_mass_coefficient: out[GEOMETRY_ADDED_MASS]!,
  };
}

/** Positions in the array writeGeometry fills. */
export const GEOMETRY_AREA = 0;
export const GEOMETRY_VOLUME = 1;
export const GEOMETRY_LENGTH = 2;
export const GEOMETRY_ALONG_FALL = 3;
export const GEOMETRY_ADDED_MASS = 4;
const geometryScratch = new Float64Array(5);

/**
 * The numbers of geometryFromDimensions written into `out` (area, volume, Reynolds length, length along the fall
 * (NaN for a custom shape), default C_a at the GEOMETRY_* positions): the Monte Carlo evaluates the geometry once
 * per draw, and an object per draw would cost more in the collector than the arithmetic.
 */
export function writeGeometry(shape: SpecimenShape, dims: ArrayLike<number>, characteristicLength: number | undefined, out: Float64Array): void {
  const d0 = dims[0]!;
  const d1 = dims[1]!;
  switch (shape) {
    case 'sphere': {
      out[GEOMETRY_AREA] = (Math.PI * d0 * d0) / 4;
      out[GEOMETRY_VOLUME] = (Math.PI * d0 * d0 * d0) / 6;
      out[GEOMETRY_LENGTH] = d0;
      out[GEOMETRY_ALONG_FALL] = d0;
      out[GEOMETRY_ADDED_MASS] = 0.5;
      return;
    }
    case 'cylinder':
    case 'disc': {
      const area = (Math.PI * d0 * d0) / 4;
      const volume = area * d1;
      out[GEOMETRY_AREA] = area;
      out[GEOMETRY_VOLUME] = volume;
      out[GEOMETRY_LENGTH] = d0;
      out[GEOMETRY_ALONG_FALL] = d1;
      out[GEOMETRY_ADDED_MASS] = equivalentSpheroidAddedMassCoefficient(area, d1, volume);
      return;
    }
    case 'box': {
      const area = d0 * d1;
      const t = dims[2]!;
      const volume = area * t;
      out[GEOMETRY_AREA] = area;
      out[GEOMETRY_VOLUME] = volume;
      out[GEOMETRY_LENGTH] = Math.sqrt((4 * area) / Math.PI);
      out[GEOMETRY_ALONG_FALL] = t;
      out[GEOMETRY_ADDED_MASS] = equivalentSpheroidAddedMassCoefficient(area, t, volume);
      return;
    }
    case 'custom': {
      out[GEOMETRY_AREA] = d0;
      out[GEOMETRY_VOLUME] = d1;
      out[GEOMETRY_LENGTH] = characteristicLength ?? Math.sqrt((4 * d0) / Math.PI);
      out[GEOMETRY_ALONG_FALL] = NaN;
      out[GEOMETRY_ADDED_MASS] = 0;
      return;
    }
  }
}

export interface CheckedSpecimen {
  input: SpecimenInput;
  mass_kg: number;
  dimensions: number[];
  dimension_names: readonly string[];
  geometry: SpecimenGeometry;
  reference_drag_coefficient: number | null;
}

/** The smallest positive normal double (IEEE 754-2019 binary64; Number.MIN_VALUE, 5e-324, is subnormal). */
const MIN_NORMAL = 2.2250738585072014e-308;

/**
 * A dimension that is above 0 can still give a frontal area or a Reynolds length that underflows to 0 or to a
 * subnormal number (a diameter of 5e-324 m squares to 0), where the drag laws divide by zero. Refused by the
 * field that caused it, with the range it must be in.
 */
function checkRepresentable(
  geometry: SpecimenGeometry,
  shape: SpecimenShape,
  field: string,
  names: readonly string[],
  dims: readonly number[],
  characteristic: number | undefined,
): void {
  const lengthBad = !(geometry.characteristic_length_m >= MIN_NORMAL);
  if (!(geometry.area_m2 >= MIN_NORMAL) || lengthBad) {
    const byCharacteristic = lengthBad && characteristic !== undefined;
    const name = byCharacteristic ? 'characteristic_length_m' : names[dims.indexOf(Math.min(...dims))]!;
    const value = byCharacteristic ? characteristic : dims[names.indexOf(name)];
    const range = name === 'area_m2' ? SPECIMEN_LIMITS.area_m2 : SPECIMEN_LIMITS.length;
    throw new PhysicsInputError({
      code: 'out-of-range',
      field: `${field}.${name}`,
      value,
      allowed: `${range.text}, large enough that the ${shape}'s frontal area and Reynolds length are normal numbers (at least ${MIN_NORMAL} m² and m)`,
      reason: 'too small to compute with: its frontal area or Reynolds length underflows',
    });
  }
}

/** Validate a specimen (untrusted shape) and derive its geometry. */
export function checkSpecimen(specimen: unknown, field = 'specimen'): CheckedSpecimen {
  if (typeof specimen !== 'object' || specimen === null || Array.isArray(specimen)) {
    throw new PhysicsInputError({ code: 'wrong-type', field, value: specimen, allowed: 'an object' });
  }
  const s = specimen as Record<string, unknown>;
  const shape = s['shape'];
  if (typeof shape !== 'string' || !(shape in SHAPE_DIMENSIONS)) {
    throw new PhysicsInputError({
      code: shape === undefined ? 'missing-field' : 'out-of-range',
      field: `${field}.shape`,
      value: shape,
      allowed: Object.keys(SHAPE_DIMENSIONS).map((k) => `"${k}"`).join(', '),
    });
  }
  const typedShape = shape as SpecimenShape;
  const names = SHAPE_DIMENSIONS[typedShape];
  const known = new Set<string>(['shape', 'mass_kg', 'reference_drag_coefficient', ...names]);
  if (typedShape === 'custom') known.add('characteristic_length_m');
  for (const key of Object.keys(s)) {
    if (!known.has(key)) {
      throw new PhysicsInputError({
        code: 'unknown-field',
        field: `${field}.${key}`,
        value: s[key],
        allowed: `for shape "${typedShape}": ${[...known].join(', ')}`,
      });
    }
  }
  const mass = checkNumber(`${field}.mass_kg`, s['mass_kg'], SPECIMEN_LIMITS.mass_kg);
  const dims = names.map((name) => {
    const range =
      name === 'area_m2' ? SPECIMEN_LIMITS.area_m2 : name === 'volume_m3' ? SPECIMEN_LIMITS.volume_m3 : SPECIMEN_LIMITS.length;
    return checkNumber(`${field}.${name}`, s[name], range);
  });
  const characteristic = checkOptionalNumber(`${field}.characteristic_length_m`, s['characteristic_length_m'], SPECIMEN_LIMITS.length);
  const reference =
    checkOptionalNumber(`${field}.reference_drag_coefficient`, s['reference_drag_coefficient'], SPECIMEN_LIMITS.reference_drag_coefficient) ??
    null;
  const geometry = geometryFromDimensions(typedShape, dims, characteristic);
  checkRepresentable(geometry, typedShape, field, names, dims, characteristic);
  return {
    input: specimen as SpecimenInput,
    mass_kg: mass,
    dimensions: dims,
    dimension_names: names,
    geometry,
    reference_drag_coefficient: reference,
  };
}

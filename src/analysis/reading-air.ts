// The air density of one reading (CIPM-2007 through the physics core), for lists that show it beside the reading.
import { airProperties, PhysicsInputError, type AirInput, type AirProperties } from '../physics';
import type { ReadingRecord, SiteRecord } from '../log';
import { airInput } from './series-request';

/** ρ of the reading's air at the site's elevation, kg/m³; null when the physics refuses the reading. */
export function readingAirDensity(reading: ReadingRecord, site: SiteRecord | null): number | null {
  try {
    return airProperties(airInput(reading).air, site?.elevation_m).density_kg_m3;
  } catch {
    return null;
  }
}

/** What a crew has typed of a reading so far: the air's own inputs without uncertainties. */
export type TypedAir = AirInput;

/** The air figures of a reading being typed, or the physics' message naming the field, value and range. */
export function typedAirProperties(air: TypedAir, site: SiteRecord | null): { ok: true; air: AirProperties } | { ok: false; message: string } {
  try {
    return { ok: true, air: airProperties(air, site?.elevation_m) };
  } catch (error) {
    if (error instanceof PhysicsInputError) return { ok: false, message: error.message };
    throw error;
  }
}

// The air density of one reading (CIPM-2007 through the physics core), for lists that show it beside the reading.
import { airProperties } from '../physics';
import type { ReadingRecord, SiteRecord } from '../log/types';
import { airInput } from './series-request';

/** ρ of the reading's air at the site's elevation, kg/m³; null when the physics refuses the reading. */
export function readingAirDensity(reading: ReadingRecord, site: SiteRecord | null): number | null {
  try {
    return airProperties(airInput(reading).air, site?.elevation_m).density_kg_m3;
  } catch {
    return null;
  }
}

/**
 * The core's sentences in the crew's units. Physics warnings, advice and error messages are plain SI sentences
 * with a stable `code`; a screen shows them through here, so "from 8.3 m" reads "from 27.2 ft" after the switch
 * to US customary, and a converted reading prints without a floating-point tail ("14.000000000000004 °C" → "14.0 °C").
 *
 * Two ways: a warning whose figures the screen can reach is written afresh from its code and those figures
 * (the CIPM-2007 range notes, from the air the result carries); anything else has each "number SI-unit" it
 * contains rewritten in place.
 */
import type { PhysicsWarning } from '../physics';

/**
 * The range CIPM-2007 was validated for, as physics/airProperties.ts states it (a test holds the two equal). Kept
 * here so the day's first screen, which words warnings, does not load the physics before it is idle.
 */
export const CIPM_RANGE_SHOWN = { pressure_Pa: [60_000, 110_000], temperature_C: [15, 27] } as const;
import { inChosenUnits, type FormatQuantity } from '../widgets/units';

export { inChosenUnits, type FormatQuantity } from '../widgets/units';

/** The air a warning came with, as far as the screen knows it. */
export interface WarningAir {
  temperature_C?: number | null;
  station_pressure_Pa?: number | null;
}

/** A physics warning as a sentence in the crew's units. */
export function warningText(warning: PhysicsWarning, format: FormatQuantity, air: WarningAir = {}): string {
  if (warning.code === 'outside-cipm-temperature-range' && air.temperature_C != null) {
    const [low, high] = CIPM_RANGE_SHOWN.temperature_C;
    const range = `${format(low, 'temperature', 0).replace(/ \S+$/, '')}–${format(high, 'temperature', 0)}`;
    return `Air temperature ${format(air.temperature_C, 'temperature')} is outside ${range}, the range CIPM-2007 was validated for; the density is extrapolated (typically still within 0.1 % outdoors).`;
  }
  if (warning.code === 'outside-cipm-pressure-range' && air.station_pressure_Pa != null) {
    const [low, high] = CIPM_RANGE_SHOWN.pressure_Pa;
    const range = `${format(low, 'pressure', 0).replace(/ \S+$/, '')}–${format(high, 'pressure', 0)}`;
    return `Station pressure ${format(air.station_pressure_Pa, 'pressure')} is outside ${range}, the range CIPM-2007 was validated for; the density is extrapolated.`;
  }
  return inChosenUnits(warning.message, format);
}

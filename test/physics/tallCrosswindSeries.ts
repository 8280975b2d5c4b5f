/**
 * A five-drop 3000 m series through the air column with a 4 m/s crosswind (an invented scenario of our own: a
 * 0.5 kg, 100 mm ball, hand-timed), shared by the physics bench and the constant-law fixture. Not yet validated.
 */
import type { AnalysisRequest } from '../../src/physics/analysisTypes';

export const TALL_CROSSWIND_SERIES: AnalysisRequest = {
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55, wind_speed_m_s: 4 },
  specimen: { shape: 'sphere', mass_kg: 0.5, diameter_m: 0.1 },
  drops: [78.02, 77.95, 78.08, 78.0, 77.97].map((t) => ({ height_m: 3000, time_s: t })),
  timing: { standard_uncertainty_s: 0.05 },
  uncertainty: { height_m: 1, mass_kg: 0.001, diameter_m: 0.0003, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 },
};

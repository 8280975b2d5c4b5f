/**
 * The request and result of one series' analysis: the JSON shapes the office command reads
 * and prints and the screens pass around. SI throughout, the unit in every field name.
 * A field may be added; none may change meaning.
 */
import type { AirInput, PressureReference } from './airProperties';
import type { DragLaw, DragLawOption } from './dragLaw';
import type { SiteInput } from './normalGravity';
import type { PhysicsWarning } from './physicsWarning';
import type { SpecimenInput } from './specimenGeometry';
import type { TimingMethod } from './timingMethodDefaults';

/** One point of a drop's fall: the distance fallen from the release point against the time from the release. */
export interface DropMark {
  /** Distance fallen from the release point, m (≥ 0, at most the drop's height). */
  distance_m: number;
  /** Time from the release, s (with an unknown release: from its estimate, so it may be slightly negative). */
  time_s: number;
}

export interface DropInput {
  /** The caller's own name for the drop (the log's drop id); carried to its result so rows join by it, never by position. */
  id?: string;
  /**
   * Release height above the point where the time stops, m. With marks a JSON request may leave it (and time_s)
   * out; the validated request always has them: the landing when given (then also the last mark), else the last mark.
   */
  height_m: number;
  /** Measured fall time from release, s. */
  time_s: number;
  /**
   * Several points of the fall (video, light gates, typed): 2 to 64, strictly increasing in distance and time.
   * In the validated request the landing (height_m, time_s), when given apart, is the last mark.
   */
  marks?: DropMark[];
  /**
   * Default true. False: the zero of this drop's times is itself an estimate (video), and the fit estimates the
   * drop's own release time shift.
   */
  release_time_known?: boolean;
}

export interface TimingInput {
  /**
   * Standard uncertainty of one drop's time from random causes, s (shrinks with more drops). A JSON request may
   * leave it out when `method` has a default (see timingMethodDefaults.ts); the validated request always has it.
   */
  standard_uncertainty_s: number;
  /** "fit": fit a constant start/stop delay together with C_d (needs three distinct heights). */
  offset?: 'none' | 'fit';
  /** How the times were taken; gives defaults for the random and the systematic parts (explicit values win). */
  method?: TimingMethod;
  /**
   * A declared constant delay, measured minus true, s (a timer that stops late reads positive); default 0, or the
   * method's. Subtracted from every time; with "fit" it is the prior the fitted offset is checked against.
   */
  offset_s?: number;
  /** Standard uncertainty of the declared delay, s: one error shared by every drop of the series. */
  offset_standard_uncertainty_s?: number;
  /**
   * Drops with marks and a known release: the standard uncertainty of the release instant itself, s, one error
   * shared by every mark of the drop (each mark's own reading has standard_uncertainty_s). Default: the method's
   * (timingMethodDefaults.ts), else 0.
   */
  release_standard_uncertainty_s?: number;
}

/** Standard uncertainties of the inputs, in the inputs' own units. Missing ones count as zero (with a warning). */
export interface UncertaintyInput {
  height_m?: number;
  mass_kg?: number;
  diameter_m?: number;
  length_m?: number;
  width_m?: number;
  thickness_m?: number;
  area_m2?: number;
  volume_m3?: number;
  temperature_C?: number;
  pressure_Pa?: number;
  relative_humidity_pct?: number;
  dew_point_C?: number;
  density_kg_m3?: number;
  gravity_m_s2?: number;
  /**
   * Of the added-mass coefficient C_a (dimensionless). Without it C_a counts as exactly known, as before, and a
   * warning gives the shape's default (addedMassCoefficient.ts) when it would matter.
   */
  added_mass_coefficient?: number;
  /** Of the lapse rate along the fall (one reading only), K/m; default 0.0033 (see airColumn.ts). */
  lapse_rate_K_per_m?: number;
  /** Of the vertical wind, m/s; default from the recorded wind (see airMotionDefaults in airColumnInputs.ts). */
  vertical_wind_m_s?: number;
  /** Of the horizontal wind speed, m/s; default from the recorded wind. */
  wind_speed_m_s?: number;
  /**
   * Marks only: the random error of each mark's distance, m (a video detector's position noise on the scale),
   * independent from mark to mark; it enters each mark's time as that error over the speed there (effective variance).
   */
  mark_distance_m?: number;
  /**
   * Marks only: the relative standard uncertainty of each drop's distance scale (a clip's scale marks), independent
   * between drops, dimensionless. The distances' own tape errors are height_m, one per distinct distance.
   */
  mark_scale_relative?: number;
}

/**
 * A second air reading at another height (typically at the release point): the fields of `air` without a density
 * override or CO2 (those of `air` hold), `height_m` required. Its uncertainties are those of `air`'s readings
 * (the same kind of instruments), independent of them.
 */
export interface AirAloftInput {
  height_m: number;
  temperature_C: number;
  pressure_Pa: number;
  pressure_reference: PressureReference;
  /** Neither given: the vapour mole fraction of `air` is kept. */
  relative_humidity_pct?: number;
  dew_point_C?: number;
  vertical_wind_m_s?: number;
  wind_speed_m_s?: number;
}

export interface AnalysisOptions {
  /** Default true. */
  buoyancy?: boolean;
  /** Default by shape: 0.5 for a sphere (potential flow), a spheroid estimate for cylinder, disc and box, 0 for custom. */
  added_mass_coefficient?: number;
  /** Monte Carlo draws, exactly; without it the draws are adaptive (JCGM 101 §7.9, batches of 2000 up to 200 000). */
  monte_carlo_draws?: number;
  /** Seed of the Monte Carlo generator; a fixed default keeps results reproducible. */
  seed?: number;
  /**
   * How C_d may depend on speed (dragLaw.ts): "constant", "scaled_sphere" (the standard sphere curve times one
   * fitted factor), or "auto" (the default): scaled_sphere for a sphere or custom shape whose standard curve changes
   * by more than the series' relative uncertainty across its Reynolds range, constant otherwise.
   */
  drag_law?: DragLawOption;
}

export interface AnalysisRequest {
  site: SiteInput;
  air: AirInput;
  /** A second reading at another height; with it the air along the fall is interpolated (airColumn.ts). */
  air_aloft?: AirAloftInput;
  specimen: SpecimenInput;
  drops: DropInput[];
  timing: TimingInput;
  uncertainty?: UncertaintyInput;
  options?: AnalysisOptions;
}

export interface DropResult {
  /** The request drop's id, when it had one. */
  id?: string;
  height_m: number;
  time_s: number;
  /**
   * This drop's own C_d: the one that makes the series' drag law reproduce its time (less the fitted timing
   * offset, or the declared delay); null when that time is not longer than a drag-free fall. Under scaled_sphere
   * it is the drop's own factor on the curve, given as the series gives its C_d (at that factor's terminal Re).
   */
  drag_coefficient: number | null;
  /** √(2h/g): no air at all. */
  vacuum_time_s: number;
  /** From the reference C_d, or for a sphere from the standard drag curve (standardSphereDrag.ts); null without either. */
  predicted_time_s: number | null;
  /** The fitted series model's time (offset included when fitted). */
  fitted_time_s: number;
  /** Measured minus fitted. */
  residual_s: number;
  /** Only for a drop with marks: each mark with the fitted model's time (release shift and offset included) and measured minus fitted. */
  marks?: { distance_m: number; time_s: number; fitted_time_s: number; residual_s: number }[];
  /** Only for a drop with marks: the fitted release time shift on the drop's own times, s; null when the release time is known. */
  release_shift_s?: number | null;
  /** From the fitted model. */
  impact_speed_m_s: number;
  impact_energy_J: number;
  /** At impact, from the fitted model. */
  reynolds_number: number;
}

export interface HeightResult {
  height_m: number;
  count: number;
  mean_time_s: number;
  standard_deviation_s: number | null;
  standard_error_s: number | null;
  t_interval_95_s: [number, number] | null;
  /** Null below three drops. Flags only: no drop is ever left out because of it. */
  grubbs: { statistic: number; critical_value: number; alpha: number; suspect_drop_index: number; outlier: boolean } | null;
}

export interface BudgetRow {
  input: string;
  standard_uncertainty: number;
  sensitivity: number;
  contribution: number;
  evaluation: 'A' | 'B';
  description: string;
  degrees_of_freedom: number | null;
}

export interface AnalysisResult {
  air: {
    density_kg_m3: number;
    station_pressure_Pa: number | null;
    dynamic_viscosity_Pa_s: number;
    speed_of_sound_m_s: number;
    density_source: 'cipm-2007' | 'override';
    cipm_density_kg_m3: number | null;
    sea_level_pressure_Pa: number | null;
    vapour_mole_fraction: number | null;
    compressibility_factor: number | null;
  };
  gravity_m_s2: number;
  gravity_source: 'wgs84-normal-gravity' | 'override';
  /** Null when drag is not resolved (see drag_resolved and drag_coefficient_upper_bound_95). */
  drag_coefficient: number | null;
  /** The least-squares value itself, even when not resolved (may then be slightly negative). */
  drag_coefficient_estimate: number;
  drag_coefficient_standard_uncertainty: number;
  /** Monte Carlo coverage interval; [0, upper bound] when drag is not resolved. */
  drag_coefficient_interval_95: [number, number];
  drag_resolved: boolean;
  /** Only when drag is not resolved: C_d is below this with 95 % probability. */
  drag_coefficient_upper_bound_95?: number;
  /**
   * Only when fitted: measured minus true time, s (a timer that stops late reads positive), fitted under the drag
   * law of the result (under scaled_sphere beside the factor, its Monte Carlo draws mapped to that law).
   */
  timing_offset_s?: number;
  timing_offset_standard_uncertainty_s?: number;
  timing_offset_interval_95_s?: [number, number];
  /** Only when a delay was declared (offset_s, its uncertainty or a timing method): what the analysis used. */
  declared_timing_offset?: {
    offset_s: number;
    standard_uncertainty_s: number;
    method: TimingMethod | null;
    /** Where the values come from: "given", or the method's source. */
    source: string;
  };
  /**
   * The drag law the result is given in (options.drag_law, or what "auto" chose) and why; see dragLaw.ts. With
   * scaled_sphere, drag_coefficient (its estimate, standard uncertainty and interval) is C_d at the terminal Reynolds
   * number, and the fitted times, residuals, scatter (its Type A row and the Monte Carlo's timing noise), each drop's
   * C_d, the fitted offset, the budget rows and gum are the scaled law's; monte_carlo stays the summary of the
   * constant-C_d draws every draw is mapped from.
   */
  drag_law: DragLaw;
  drag_law_details: {
    requested: DragLawOption;
    reason: string;
    /** Reynolds numbers the law was judged over: half the lowest impact Re up to the highest impact Re. */
    reynolds_range: [number, number];
    /** The standard sphere curve's relative change across that range. */
    sphere_curve_change: number;
    /** The constant-C_d fit, whatever the law (the value every draw of the uncertainty starts from). */
    constant_drag_coefficient: number;
    /** Only for scaled_sphere: the fitted factor on the standard sphere curve, its standard uncertainty and interval. */
    scale_factor: number | null;
    scale_factor_standard_uncertainty: number | null;
    scale_factor_interval_95: [number, number] | null;
    /** Re at the terminal (settling) speed, and the law's C_d there (for scaled_sphere this is drag_coefficient). */
    terminal_reynolds_number: number | null;
    drag_coefficient_at_terminal: number | null;
    /** The law's C_d at the highest impact Reynolds number of the series. */
    drag_coefficient_at_max_impact: number | null;
    /**
     * Per-height C_d (constant) or factor (scaled_sphere), each from its own height's mean time, tested for a trend
     * against ln(height): slope over its standard error. Null below three heights (four with a fitted offset).
     */
    trend_z: number | null;
    /** True when |trend_z| > 2: the law does not fit these heights (a warning says so). */
    misfit: boolean;
  };
  /** Null when drag is not resolved. For scaled_sphere, the speed where s·C_d,std(Re)·v² balances effective gravity. */
  terminal_velocity_m_s: number | null;
  /** Only when drag is not resolved. */
  terminal_velocity_lower_bound_m_s?: number;
  drops: DropResult[];
  heights: HeightResult[];
  budget: BudgetRow[];
  gum: {
    combined_standard_uncertainty: number;
    effective_degrees_of_freedom: number | null;
    coverage_factor: number;
    interval_95: [number, number];
  };
  monte_carlo: {
    draws: number;
    failed_draws: number;
    seed: number;
    mean: number;
    standard_deviation: number;
    interval_95: [number, number];
    upper_bound_95: number;
    /**
     * Present when the request did not name its number of draws: the draws went on in batches until the mean, the
     * standard deviation, both interval ends and the one-sided bound were each stable to the numerical tolerance
     * (JCGM 101 §7.9; see monteCarloPropagation.ts), at most max_draws.
     */
    adaptive?: {
      batch_size: number;
      batches: number;
      /** δ in units of C_d: each reported value is within it with about 95 % probability (2s ≤ δ). */
      numerical_tolerance: number;
      /** δ as a fraction of the Monte Carlo standard deviation (1/20). */
      relative_tolerance: number;
      max_draws: number;
      stabilized: boolean;
    };
  };
  prediction: {
    /** 'morrison-sphere-correlation' only in results made before the standard curve replaced it. */
    method: 'reference-drag-coefficient' | 'standard-sphere-drag-curve' | 'morrison-sphere-correlation' | 'none';
    reference_drag_coefficient: number | null;
    /**
     * Only for the standard sphere curve: its own relative standard uncertainty of C_d at the fastest impact (5 % up
     * to Re 1e5, growing to 10 % at 2e5 and 50 % in the drag crisis; standardSphereDragRelativeUncertainty).
     */
    drag_coefficient_relative_standard_uncertainty?: number;
    /** Only for the standard sphere curve: per height, the predicted time and the curve's uncertainty carried to it. */
    heights?: { height_m: number; time_s: number; time_standard_uncertainty_s: number; drag_coefficient_relative_standard_uncertainty: number }[];
  };
  model: {
    /** The specimen's mass, kg. */
    mass_kg: number;
    buoyancy: boolean;
    added_mass_coefficient: number;
    area_m2: number;
    volume_m3: number;
    characteristic_length_m: number;
    effective_mass_kg: number;
    effective_gravity_m_s2: number;
    timing_offset: 'none' | 'fit';
    scatter_standard_deviation_s: number | null;
    scatter_degrees_of_freedom: number;
  };
  /**
   * The air along the fall and its motion (airColumn.ts, fallThroughColumn.ts): absent when nothing about them
   * was computed (older results).
   */
  air_column?: {
    /** 0: the closed form in uniform still air stands; 1: the fall through the column is used; between: blended. */
    weight: number;
    /** The column's and the air's motion's effect on the fall times, over the smallest standard uncertainty of a mean time. */
    effect_over_uncertainty: number;
    /** C_d in the column over C_d in uniform still air at the reading (1 when the weight is 0). */
    correction_ratio: number;
    readings: 1 | 2;
    /** The lapse rate used, K/m (with two readings: theirs). */
    lapse_rate_K_per_m: number;
    lapse_rate_standard_uncertainty_K_per_m: number | null;
    vertical_wind_m_s: number;
    vertical_wind_standard_uncertainty_m_s: number | null;
    wind_speed_m_s: number;
    wind_speed_standard_uncertainty_m_s: number | null;
    /** Where the defaults came from, when any was used. */
    notes: string[];
    /** At the highest release height, from the fitted model. */
    density_at_release_kg_m3: number;
    density_at_landing_kg_m3: number;
    impact_mach: number;
    drift_m: number;
  };
  warnings: PhysicsWarning[];
}

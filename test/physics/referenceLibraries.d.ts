// Types for the general-purpose reference libraries the physics tests check against.
// psychrolib and jstat ship plain JavaScript without declarations; only what the tests use is typed.

declare module 'psychrolib' {
  interface Psychrolib {
    SI: number;
    IP: number;
    SetUnitSystem(system: number): void;
    /** Saturation vapour pressure over water/ice (Hyland–Wexler, ASHRAE 2017 ch. 1), Pa; °C in. */
    GetSatVapPres(TDryBulb_C: number): number;
    GetHumRatioFromRelHum(TDryBulb_C: number, RelHum: number, Pressure_Pa: number): number;
    GetHumRatioFromTDewPoint(TDewPoint_C: number, Pressure_Pa: number): number;
    GetMoistAirDensity(TDryBulb_C: number, HumRatio: number, Pressure_Pa: number): number;
    GetDryAirDensity(TDryBulb_C: number, Pressure_Pa: number): number;
    GetStandardAtmPressure(Altitude_m: number): number;
    GetTDewPointFromRelHum(TDryBulb_C: number, RelHum: number): number;
    GetVapPresFromRelHum(TDryBulb_C: number, RelHum: number): number;
    GetHumRatioFromVapPres(VapPres_Pa: number, Pressure_Pa: number): number;
  }
  const psychrolib: Psychrolib;
  export default psychrolib;
}

declare module 'jstat' {
  interface JStat {
    studentt: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
    normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
    chisquare: { cdf(x: number, dof: number): number };
    ibeta(x: number, a: number, b: number): number;
    gammaln(x: number): number;
    mean(values: number[]): number;
    stdev(values: number[], sample?: boolean): number;
  }
  const jStat: JStat;
  export default jStat;
}

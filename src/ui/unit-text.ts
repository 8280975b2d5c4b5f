/**
 * The core's sentences in the crew's units. Physics warnings, advice and error messages are plain SI sentences
 * with a stable `code`; a screen shows them through here, so "from 8.3 m" reads "from 27.2 ft" after the switch
 * to US customary, and a converted reading prints without a floating-point tail ("14.000000000000004 °C" → "14.0 °C").
 *
 * Two ways: a warning whose figures the screen can reach is written afresh from its code and those figures
 * (the CIPM-2007 range notes, from the air the result carries); anything else has each "number SI-unit" it
 * contains rewritten in place.
 */
import { CIPM_VALID_RANGE, type PhysicsWarning } from '../physics';
import { unitFor, type QuantityKind } from '../widgets/units';

export type FormatQuantity = (valueSI: number | null | undefined, kind: QuantityKind, decimals?: number) => string;

/** The SI symbols the core writes, the quantity each is, and the factor from the symbol to the SI base. */
const SI_SYMBOLS: ReadonlyArray<{ symbol: string; kind: QuantityKind; factor: number }> = [
  { symbol: 'kg/m³', kind: 'density', factor: 1 },
  { symbol: 'm/s²', kind: 'acceleration', factor: 1 },
  { symbol: 'm/s', kind: 'speed', factor: 1 },
  { symbol: '°C', kind: 'temperature', factor: 1 },
  { symbol: 'hPa', kind: 'pressure', factor: 100 },
  { symbol: 'Pa', kind: 'pressure', factor: 1 },
  { symbol: 'kg', kind: 'mass', factor: 1 },
  { symbol: 'mm', kind: 'smallLength', factor: 1e-3 },
  { symbol: 'm', kind: 'length', factor: 1 },
  { symbol: 'J', kind: 'energy', factor: 1 },
];

// Plain, or grouped by thin spaces as the core writes large numbers ("110 000").
const NUMBER = String.raw`-?\d{1,3}(?: \d{3})+(?:\.\d+)?|-?\d+(?:\.\d+)?(?:e[-+]?\d+)?`;
const ESCAPED = SI_SYMBOLS.map((u) => u.symbol.replace(/[/.]/g, (c) => `\\${c}`)).join('|');
// A number, optionally a range "a–b" or "a to b", then one SI symbol not followed by more of a word ("ms", "m/s").
const QUANTITY = new RegExp(String.raw`(${NUMBER})(?:(–| to )(${NUMBER}))? ?(${ESCAPED})(?![\p{L}\d/²³])`, 'gu');

function decimalsOf(text: string): number {
  const m = /\.(\d+)/.exec(text);
  return m ? m[1]!.length : 0;
}

/** Every "number SI-unit" in a sentence, in the crew's unit, with no more digits than the sentence gave. */
export function inChosenUnits(text: string, format: FormatQuantity): string {
  return text.replace(QUANTITY, (whole, a: string, joiner: string | undefined, b: string | undefined, symbol: string) => {
    const unit = SI_SYMBOLS.find((u) => u.symbol === symbol);
    if (!unit) return whole;
    const shown = (source: string, withSymbol: boolean) => {
      const si = Number(source.replace(/ /g, '')) * unit.factor;
      // The digits the sentence gave (at least one decimal), never beyond the unit's usual; densities and the like
      // keep their unit's own digits, as their values are small in either system.
      const decimals = unit.kind === 'density' || unit.kind === 'acceleration' ? undefined : Math.min(unitFor(unit.kind).decimals, Math.max(1, decimalsOf(source)));
      const text = format(si, unit.kind, decimals);
      return withSymbol ? text : text.replace(/ \S+$/, '');
    };
    return b !== undefined && joiner !== undefined ? `${shown(a, false)}${joiner}${shown(b, true)}` : shown(a, true);
  });
}

/** The air a warning came with, as far as the screen knows it. */
export interface WarningAir {
  temperature_C?: number | null;
  station_pressure_Pa?: number | null;
}

/** A physics warning as a sentence in the crew's units. */
export function warningText(warning: PhysicsWarning, format: FormatQuantity, air: WarningAir = {}): string {
  if (warning.code === 'outside-cipm-temperature-range' && air.temperature_C != null) {
    const [low, high] = CIPM_VALID_RANGE.temperature_C;
    const range = `${format(low, 'temperature', 0).replace(/ \S+$/, '')}–${format(high, 'temperature', 0)}`;
    return `Air temperature ${format(air.temperature_C, 'temperature')} is outside ${range}, the range CIPM-2007 was validated for; the density is extrapolated (typically still within 0.1 % outdoors).`;
  }
  if (warning.code === 'outside-cipm-pressure-range' && air.station_pressure_Pa != null) {
    const [low, high] = CIPM_VALID_RANGE.pressure_Pa;
    const range = `${format(low, 'pressure', 0).replace(/ \S+$/, '')}–${format(high, 'pressure', 0)}`;
    return `Station pressure ${format(air.station_pressure_Pa, 'pressure')} is outside ${range}, the range CIPM-2007 was validated for; the density is extrapolated.`;
  }
  return inChosenUnits(warning.message, format);
}

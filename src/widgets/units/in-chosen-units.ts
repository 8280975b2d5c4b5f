// Sentences in the crew's units: every "number SI-unit" a sentence holds, rewritten in the chosen unit. Pure text
// work on top of the unit tables, used by the screens (ui/unit-text.ts) and the timer pad alike.
import { unitFor, type QuantityKind } from './units';

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


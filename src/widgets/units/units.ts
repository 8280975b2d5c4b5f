/**
 * Display units for each kind of quantity. Stored values are always SI; these convert at the screen's edge.
 * Factors are exact by definition (international foot, inch and pound, 1959) except the conventional
 * inch and millimetre of mercury (NIST SP 811, appendix B.8: 3386.389 Pa and 133.3224 Pa).
 */

export type QuantityKind =
  | 'length'
  | 'smallLength'
  | 'temperature'
  | 'pressure'
  | 'mass'
  | 'time'
  | 'speed'
  | 'energy'
  | 'density'
  | 'area'
  | 'volume'
  | 'percent'
  | 'angle'
  | 'ratio'
  | 'acceleration'
  | 'viscosity';

export interface UnitDef {
  /** Symbol shown after the number. */
  symbol: string;
  /** Spoken and written name, for screen readers and messages. */
  name: string;
  /** SI value of one unit. */
  scale: number;
  /** SI value of the unit's zero (temperatures only). */
  offset?: number;
  /** Decimal places that suit the usual readings in this unit. */
  decimals: number;
  /**
   * Significant digits instead of decimal places, for a unit whose values are tiny or span decades
   * (a viscosity in lb/(ft·s) is about 1.2 × 10⁻⁵): printed as a mantissa with a power of ten.
   */
  significant?: number;
}

export const UNITS: Record<QuantityKind, readonly UnitDef[]> = {
  length: [
    { symbol: 'm', name: 'metres', scale: 1, decimals: 3 },
    { symbol: 'ft', name: 'feet', scale: 0.3048, decimals: 2 },
  ],
  smallLength: [
    { symbol: 'mm', name: 'millimetres', scale: 1e-3, decimals: 2 },
    { symbol: 'in', name: 'inches', scale: 0.0254, decimals: 3 },
  ],
  temperature: [
    { symbol: '°C', name: 'degrees Celsius', scale: 1, decimals: 1 },
    { symbol: '°F', name: 'degrees Fahrenheit', scale: 5 / 9, offset: -32 * (5 / 9), decimals: 1 },
  ],
  pressure: [
    { symbol: 'hPa', name: 'hectopascals', scale: 100, decimals: 1 },
    { symbol: 'kPa', name: 'kilopascals', scale: 1000, decimals: 2 },
    { symbol: 'inHg', name: 'inches of mercury', scale: 3386.389, decimals: 2 },
    { symbol: 'mmHg', name: 'millimetres of mercury', scale: 133.322387415, decimals: 1 },
  ],
  mass: [
    { symbol: 'g', name: 'grams', scale: 1e-3, decimals: 1 },
    { symbol: 'kg', name: 'kilograms', scale: 1, decimals: 4 },
    { symbol: 'oz', name: 'ounces', scale: 0.45359237 / 16, decimals: 2 },
    { symbol: 'lb', name: 'pounds', scale: 0.45359237, decimals: 3 },
  ],
  time: [{ symbol: 's', name: 'seconds', scale: 1, decimals: 3 }],
  speed: [
    { symbol: 'm/s', name: 'metres per second', scale: 1, decimals: 2 },
    { symbol: 'ft/s', name: 'feet per second', scale: 0.3048, decimals: 1 },
  ],
  energy: [
    { symbol: 'J', name: 'joules', scale: 1, decimals: 1 },
    { symbol: 'ft·lbf', name: 'foot-pounds', scale: 1.3558179483314004, decimals: 1 },
  ],
  density: [
    { symbol: 'kg/m³', name: 'kilograms per cubic metre', scale: 1, decimals: 4 },
    // 1 lb/ft³ = 0.45359237 kg / 0.3048³ m³ (exact from the 1959 pound and foot).
    { symbol: 'lb/ft³', name: 'pounds per cubic foot', scale: 0.45359237 / 0.3048 ** 3, decimals: 5 },
  ],
  acceleration: [
    { symbol: 'm/s²', name: 'metres per second squared', scale: 1, decimals: 5 },
    { symbol: 'ft/s²', name: 'feet per second squared', scale: 0.3048, decimals: 4 },
  ],
  viscosity: [
    { symbol: 'µPa·s', name: 'micropascal seconds', scale: 1e-6, decimals: 2 },
    // The pound per foot-second, the US customary unit of dynamic viscosity: 0.45359237 / 0.3048 Pa·s.
    { symbol: 'lb/(ft·s)', name: 'pounds per foot-second', scale: 0.45359237 / 0.3048, decimals: 8, significant: 4 },
  ],
  area: [
    { symbol: 'cm²', name: 'square centimetres', scale: 1e-4, decimals: 2 },
    { symbol: 'in²', name: 'square inches', scale: 0.0254 ** 2, decimals: 2 },
  ],
  volume: [
    { symbol: 'cm³', name: 'cubic centimetres', scale: 1e-6, decimals: 1 },
    { symbol: 'in³', name: 'cubic inches', scale: 0.0254 ** 3, decimals: 2 },
  ],
  percent: [{ symbol: '%', name: 'percent', scale: 1, decimals: 1 }],
  angle: [{ symbol: '°', name: 'degrees', scale: 1, decimals: 5 }],
  ratio: [{ symbol: '', name: '', scale: 1, decimals: 3 }],
};

/** Which unit each kind shows when nothing is chosen. */
export const DEFAULT_UNITS: Record<QuantityKind, string> = {
  length: 'm',
  smallLength: 'mm',
  temperature: '°C',
  pressure: 'hPa',
  mass: 'g',
  time: 's',
  speed: 'm/s',
  energy: 'J',
  density: 'kg/m³',
  area: 'cm²',
  volume: 'cm³',
  percent: '%',
  angle: '°',
  ratio: '',
  acceleration: 'm/s²',
  viscosity: 'µPa·s',
};

/** The quantities whose unit the settings screen lets the crew choose. */
export const CHOOSABLE = [
  'length',
  'smallLength',
  'temperature',
  'pressure',
  'mass',
  'speed',
  'energy',
  'area',
  'volume',
  'density',
  'acceleration',
  'viscosity',
] as const satisfies readonly QuantityKind[];

export type ChoosableKind = (typeof CHOOSABLE)[number];

export type UnitSystem = 'si' | 'us';

/**
 * The two whole sets of units the crew switches between in one move: SI (with the hectopascal and the gram a
 * field crew reads) and US customary (the foot, inch, ounce, degree Fahrenheit and inch of mercury).
 */
export const UNIT_SYSTEMS: Record<UnitSystem, Record<ChoosableKind, string>> = {
  si: {
    length: 'm',
    smallLength: 'mm',
    temperature: '°C',
    pressure: 'hPa',
    mass: 'g',
    speed: 'm/s',
    energy: 'J',
    area: 'cm²',
    volume: 'cm³',
    density: 'kg/m³',
    acceleration: 'm/s²',
    viscosity: 'µPa·s',
  },
  us: {
    length: 'ft',
    smallLength: 'in',
    temperature: '°F',
    pressure: 'inHg',
    mass: 'oz',
    speed: 'ft/s',
    energy: 'ft·lbf',
    area: 'in²',
    volume: 'in³',
    density: 'lb/ft³',
    acceleration: 'ft/s²',
    viscosity: 'lb/(ft·s)',
  },
};

/** Which whole set a choice is, or "own" when the crew mixed units quantity by quantity. */
export function unitSystemOf(choice: UnitChoice): UnitSystem | 'own' {
  for (const system of ['si', 'us'] as const) {
    if (CHOOSABLE.every((kind) => (choice[kind] ?? DEFAULT_UNITS[kind]) === UNIT_SYSTEMS[system][kind])) return system;
  }
  return 'own';
}

export type UnitChoice = Partial<Record<QuantityKind, string>>;

export function unitFor(kind: QuantityKind, symbol?: string): UnitDef {
  const list = UNITS[kind];
  return list.find((u) => u.symbol === (symbol ?? DEFAULT_UNITS[kind])) ?? list[0]!;
}

/** A reading in the display unit to SI. */
export function toSI(value: number, unit: UnitDef): number {
  return value * unit.scale + (unit.offset ?? 0);
}

/** An SI value to the display unit. */
export function fromSI(value: number, unit: UnitDef): number {
  return (value - (unit.offset ?? 0)) / unit.scale;
}

/** A difference or an uncertainty: scale only, never the offset (1 °C of uncertainty is 1.8 °F, not 33.8). */
export function deltaToSI(value: number, unit: UnitDef): number {
  return value * unit.scale;
}

export function deltaFromSI(value: number, unit: UnitDef): number {
  return value / unit.scale;
}

/**
 * Reads a number as typed on a phone: a decimal point or a decimal comma (where the locale uses it),
 * a leading minus or the typographic minus sign, surrounding spaces. Returns null for anything else.
 */
export function parseDecimal(text: string): number | null {
  let t = text.trim().replace(/\u2212/g, '-').replace(/\s+/g, '');
  if (t === '') return null;
  if (t.includes(',')) {
    if (t.includes('.') || t.indexOf(',') !== t.lastIndexOf(',')) return null;
    t = t.replace(',', '.');
  }
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/**
 * Reads a coordinate as a crew may copy it from a map, a GPS or a survey sheet: decimal degrees (-8.25), degrees
 * and decimal minutes (8° 15.0' W), or degrees, minutes and seconds (46°06'30" N, 46 6 30 N), with a hemisphere
 * letter before or after. N and E are positive, S and W negative. `axis` names the letters this field takes
 * ("NS" for a latitude, "EW" for a longitude). Returns the signed degrees, or a reason in words.
 */
export function parseAngle(text: string, axis: 'NS' | 'EW' | '' = ''): { value: number } | { reason: string } {
  let t = text.trim().replace(/\u2212/g, '-').replace(/,/g, '.');
  let hemisphere: string | null = null;
  const letter = /^([NSEWnsew])\s*|\s*([NSEWnsew])$/;
  const m = letter.exec(t);
  if (m) {
    hemisphere = (m[1] ?? m[2])!.toUpperCase();
    t = t.replace(letter, '').trim();
    if (letter.test(t)) return { reason: 'more than one hemisphere letter' };
    if (axis && !axis.includes(hemisphere)) return { reason: `${hemisphere} is not a hemisphere of this coordinate (use ${axis[0]} or ${axis[1]})` };
  }
  const negative = t.startsWith('-');
  if (negative) t = t.slice(1).trim();
  if (negative && hemisphere) return { reason: 'both a minus sign and a hemisphere letter' };
  const numberPattern = /\d+(?:\.\d+)?|\.\d+/g;
  const numbers = t.match(numberPattern) ?? [];
  // Only degree, minute and second marks and spaces may stand between the numbers.
  if (numbers.length === 0 || numbers.length > 3 || t.replace(numberPattern, '').replace(/[°º'′"″:\s]/g, '') !== '') return { reason: 'not a coordinate' };
  const parts = numbers.map(Number);
  if (parts.slice(0, -1).some((p) => !Number.isInteger(p))) return { reason: 'only the last part may have decimals' };
  if (parts.slice(1).some((p) => p >= 60)) return { reason: 'minutes and seconds must be below 60' };
  const degrees = parts[0]! + (parts[1] ?? 0) / 60 + (parts[2] ?? 0) / 3600;
  return { value: negative || hemisphere === 'S' || hemisphere === 'W' ? -degrees : degrees };
}

/**
 * Formats a display value with the unit's usual decimals, using a decimal comma when asked. Rounding first keeps
 * floating-point tails out (14.000000000000004 prints as 14.0), and a value that rounds to zero never prints as
 * "-0.0".
 */
export function formatNumber(value: number, decimals: number, decimalComma = false): string {
  if (!Number.isFinite(value)) return '—';
  const text = value.toFixed(decimals).replace(/^-(0\.?0*)$/, '$1');
  return decimalComma ? text.replace('.', ',') : text;
}

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** A value to `digits` significant digits; outside 0.001 to 100 000 as "1.215 × 10⁻⁵". */
export function formatSignificant(value: number, digits: number, decimalComma = false): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  let text: string;
  if (magnitude >= 1e-3 && magnitude < 1e5) {
    text = String(Number(value.toPrecision(digits)));
  } else {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e') as [string, string];
    const power = String(Number(exponent)).replace(/[-0-9]/g, (c) => SUPERSCRIPT[c]!);
    text = `${mantissa} × 10${power}`;
  }
  return decimalComma ? text.replace('.', ',') : text;
}

/** "12.34 m" style text for an SI value in the chosen unit. */
export function formatQuantity(
  valueSI: number | null | undefined,
  kind: QuantityKind,
  choice: UnitChoice = {},
  options: { decimals?: number; decimalComma?: boolean } = {},
): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return '—';
  const unit = unitFor(kind, choice[kind]);
  const shown = fromSI(valueSI, unit);
  const text =
    unit.significant !== undefined && options.decimals === undefined
      ? formatSignificant(shown, unit.significant, options.decimalComma)
      : formatNumber(shown, options.decimals ?? unit.decimals, options.decimalComma);
  return unit.symbol ? `${text} ${unit.symbol}` : text;
}

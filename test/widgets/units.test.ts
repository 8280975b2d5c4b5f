import { describe, expect, it } from 'vitest';
import { CHOOSABLE, DEFAULT_UNITS, UNIT_SYSTEMS, deltaToSI, formatNumber, formatQuantity, formatSignificant, fromSI, parseAngle, parseDecimal, toSI, unitFor, unitSystemOf } from '../../src/widgets/units';

describe('display units', () => {
  it('converts with the exact definitions of the international foot, inch and pound (NIST SP 811, B.8)', () => {
    expect(toSI(1, unitFor('length', 'ft'))).toBe(0.3048);
    expect(toSI(1, unitFor('smallLength', 'in'))).toBe(0.0254);
    expect(toSI(1, unitFor('mass', 'lb'))).toBe(0.45359237);
    expect(toSI(16, unitFor('mass', 'oz'))).toBeCloseTo(0.45359237, 15);
  });

  it('converts the conventional inch and millimetre of mercury (NIST SP 811, B.8: 3386.389 Pa, 133.3224 Pa)', () => {
    expect(toSI(29.92, unitFor('pressure', 'inHg'))).toBeCloseTo(101_320.8, 1);
    // The conventional mmHg (13.5951 g/cm³ · 9.80665 m/s² · 1 mm = 133.322387415 Pa) is not quite the torr
    // (101 325/760 = 133.3223684 Pa): 760 mmHg is one standard atmosphere plus 0.0144 Pa.
    expect(toSI(760, unitFor('pressure', 'mmHg'))).toBeCloseTo(101_325.0144, 3);
  });

  it('converts Fahrenheit with its offset, but a temperature uncertainty by scale alone', () => {
    expect(toSI(212, unitFor('temperature', '°F'))).toBeCloseTo(100, 12); // boiling point of water at 1 atm
    expect(toSI(32, unitFor('temperature', '°F'))).toBeCloseTo(0, 12);
    expect(fromSI(-40, unitFor('temperature', '°F'))).toBeCloseTo(-40, 12);
    expect(deltaToSI(1.8, unitFor('temperature', '°F'))).toBeCloseTo(1, 12);
  });

  it('reads a decimal comma or point, the minus sign, and refuses anything ambiguous', () => {
    expect(parseDecimal('12,5')).toBe(12.5);
    expect(parseDecimal(' 12.5 ')).toBe(12.5);
    expect(parseDecimal('\u22123.2')).toBe(-3.2);
    expect(parseDecimal('1e-3')).toBe(0.001);
    expect(parseDecimal('1,234.5')).toBeNull();
    expect(parseDecimal('1,2,3')).toBeNull();
    expect(parseDecimal('12 m')).toBeNull();
    expect(parseDecimal('')).toBeNull();
  });

  it('formats an SI value in the chosen unit with its symbol', () => {
    expect(formatQuantity(12.3456, 'length')).toBe('12.346 m');
    expect(formatQuantity(12.3456, 'length', { length: 'ft' })).toBe('40.50 ft');
    expect(formatQuantity(96_120, 'pressure', {}, { decimalComma: true })).toBe('961,2 hPa');
    expect(formatQuantity(null, 'mass')).toBe('—');
  });

  it('converts air density, gravity and viscosity to US customary as the U.S. Standard Atmosphere 1976 tabulates them', () => {
    // U.S. Standard Atmosphere 1976, sea level: 1.2250 kg/m³ = 0.076474 lb/ft³; standard gravity 9.80665 m/s² =
    // 32.1740 ft/s²; viscosity 1.7894e-5 Pa·s = 3.7373e-7 lbf·s/ft² (× 32.174 ft/s² = 1.2024e-5 lb/(ft·s)).
    expect(fromSI(1.225, unitFor('density', 'lb/ft³'))).toBeCloseTo(0.076474, 6);
    expect(fromSI(9.80665, unitFor('acceleration', 'ft/s²'))).toBeCloseTo(32.174, 3);
    expect(fromSI(1.7894e-5, unitFor('viscosity', 'lb/(ft·s)'))).toBeCloseTo(1.2024e-5, 8);
    expect(formatQuantity(1.7894e-5, 'viscosity', { viscosity: 'lb/(ft·s)' })).toBe('1.202 × 10⁻⁵ lb/(ft·s)');
    expect(formatQuantity(1.7894e-5, 'viscosity')).toBe('17.89 µPa·s');
  });

  it('switches every choosable quantity at once between SI and US customary, and knows a mixed choice', () => {
    expect(unitSystemOf({ ...DEFAULT_UNITS })).toBe('si');
    expect(unitSystemOf({ ...UNIT_SYSTEMS.us })).toBe('us');
    expect(unitSystemOf({ ...UNIT_SYSTEMS.us, pressure: 'hPa' })).toBe('own');
    for (const kind of CHOOSABLE) {
      // Every symbol of both sets is a unit the quantity really has (unitFor would fall back silently).
      expect(unitFor(kind, UNIT_SYSTEMS.si[kind]).symbol).toBe(UNIT_SYSTEMS.si[kind]);
      expect(unitFor(kind, UNIT_SYSTEMS.us[kind]).symbol).toBe(UNIT_SYSTEMS.us[kind]);
    }
  });

  it('prints without floating-point tails or a negative zero', () => {
    // 57.2 °F typed is 14.000000000000004 °C in binary floating point.
    const celsius = toSI(57.2, unitFor('temperature', '°F'));
    expect(String(celsius)).not.toBe('14');
    expect(formatQuantity(celsius, 'temperature')).toBe('14.0 °C');
    expect(formatNumber(-0.00004, 1)).toBe('0.0');
    expect(formatSignificant(0.0032000000000005357, 3)).toBe('0.0032');
    expect(formatSignificant(-0.00001234, 3)).toBe('-1.23 × 10⁻⁵');
    expect(formatSignificant(0.4683, 3, true)).toBe('0,468');
  });

  it('reads coordinates in degrees-minutes-seconds, decimal minutes or with hemisphere letters', () => {
    // 1° = 60′ = 3600″ (ISO 80000-3); S and W are the negative hemispheres (ISO 6709).
    expect(parseAngle(`46°06'30" N`, 'NS')).toEqual({ value: 46 + 6 / 60 + 30 / 3600 });
    expect(parseAngle('46 6 30 S', 'NS')).toEqual({ value: -(46 + 6 / 60 + 30 / 3600) });
    expect(parseAngle("W 8° 15.5'", 'EW')).toEqual({ value: -(8 + 15.5 / 60) });
    expect(parseAngle('7.25E', 'EW')).toEqual({ value: 7.25 });
    expect(parseAngle('46°06′30″', 'NS')).toEqual({ value: 46 + 6 / 60 + 30 / 3600 });
    expect(parseAngle('8 W', 'NS')).toEqual({ reason: 'W is not a hemisphere of this coordinate (use N or S)' });
    expect(parseAngle('-8 W', 'EW')).toEqual({ reason: 'both a minus sign and a hemisphere letter' });
    expect(parseAngle('46 75 N', 'NS')).toEqual({ reason: 'minutes and seconds must be below 60' });
    expect(parseAngle('46.5 6 N', 'NS')).toEqual({ reason: 'only the last part may have decimals' });
    expect(parseAngle('north', 'NS')).toEqual({ reason: 'not a coordinate' });
  });
});

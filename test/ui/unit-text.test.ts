import { describe, expect, it } from 'vitest';
import { formatQuantity, UNIT_SYSTEMS, type QuantityKind } from '../../src/widgets/units';
import { inChosenUnits, warningText } from '../../src/ui/unit-text';
import { airProperties } from '../../src/physics';

const us = (v: number | null | undefined, kind: QuantityKind, decimals?: number) => formatQuantity(v, kind, UNIT_SYSTEMS.us, decimals !== undefined ? { decimals } : {});
const si = (v: number | null | undefined, kind: QuantityKind, decimals?: number) => formatQuantity(v, kind, UNIT_SYSTEMS.si, decimals !== undefined ? { decimals } : {});

describe('the core sentences in the crew units', () => {
  it('rewrites heights, temperatures and pressures inside a sentence', () => {
    // 8.3 m / 0.3048 = 27.23 ft (exact international foot, NIST SP 811 B.8)
    expect(inChosenUnits('50 drops from 8.3 m reach 5.0 %.', us)).toBe('50 drops from 27.2 ft reach 5.0 %.');
    // 20 °C = 68 °F; 101 325 Pa = 29.92 inHg (conventional inch of mercury 3386.389 Pa, NIST SP 811 B.8)
    expect(inChosenUnits('at 20 °C and 101325 Pa', us)).toBe('at 68.0 °F and 29.9 inHg');
    expect(inChosenUnits('a range of 60 000–110 000 Pa', si)).toBe('a range of 600.0–1100.0 hPa');
  });

  it('leaves milliseconds, seconds, percentages and words alone', () => {
    const text = 'The fitted timing offset 12.0 ± 3.0 ms; 1.432 s; 5.0 %; made of 3 materials.';
    expect(inChosenUnits(text, us)).toBe(text);
  });

  it('prints a converted reading without a floating-point tail', () => {
    expect(inChosenUnits('Air temperature 14.000000000000004 °C is low', si)).toBe('Air temperature 14.0 °C is low');
  });

  it('writes the CIPM-2007 range note afresh from the air it came with, in °F', () => {
    // 57.2 °F typed is 14.000000000000004 °C; CIPM-2007 is validated for 15–27 °C (Picard et al. 2008) = 59–81 °F.
    const air = airProperties({ temperature_C: (57.2 - 32) * (5 / 9), pressure_Pa: 101_325, pressure_reference: 'station', relative_humidity_pct: 50 });
    const note = air.warnings.find((w) => w.code === 'outside-cipm-temperature-range')!;
    const text = warningText(note, us, { temperature_C: air.temperature_K - 273.15 });
    expect(text).toContain('57.2 °F');
    expect(text).toContain('59–81 °F');
    expect(text).not.toMatch(/°C/);
  });
});

describe('the CIPM-2007 range the screens word', () => {
  it('is the range the physics checks (Picard et al. 2008, as physics/airProperties.ts states it)', async () => {
    const { CIPM_VALID_RANGE } = await import('../../src/physics');
    const { CIPM_RANGE_SHOWN } = await import('../../src/ui/unit-text');
    expect(CIPM_RANGE_SHOWN).toEqual(CIPM_VALID_RANGE);
  });
});

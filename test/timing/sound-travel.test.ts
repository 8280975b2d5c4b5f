import { describe, expect, it } from 'vitest';
import { TimingError, correctForSoundTravel, fallTimeFromSoundCapture, soundTravelCorrection, soundTravelRecord, speedOfSoundAt } from '../../src/timing';
import { validateBody } from '../../src/log';

describe('correcting a heard interval for sound travel', () => {
  it('matches a worked example: phone on the ground 3 m from the landing point of a 12 m drop at 10 °C', () => {
    // Worked by hand (our own scenario):
    //   release point 12.00 m straight above the landing point; microphone on the ground 3.00 m to the side.
    //   d_i = 3.00 m;  d_r = √(12.00² + 3.00²) = √153 = 12.369 317 m.
    //   c at 10 °C, ISO 9613-1:1993: c = 343.2·√(283.15 / 293.15) = 343.2 × √0.965 888
    //     = 343.2 × 0.982 796 = 337.2956 m/s.
    //   correction = (d_r − d_i) / c = 9.369 317 / 337.2956 = 0.027 778 s.
    //   heard 1.5800 s  →  fall time 1.5800 + 0.027 778 = 1.607 778 s.
    const c = speedOfSoundAt(10);
    expect(c).toBeCloseTo(337.2956, 4);
    const travel = { distance_to_release_m: Math.sqrt(153), distance_to_landing_m: 3, speed_of_sound_m_s: c };
    expect(soundTravelCorrection(travel)).toBeCloseTo(0.027778, 6);
    expect(correctForSoundTravel(1.58, travel, 12)).toBeCloseTo(1.607778, 6);
  });

  it('shortens the time when the phone is at the release point, by the height over c', () => {
    // At the release point: d_r = 0, d_i = h = 10 m; at 20 °C c = 343.2 m/s (ISO 9613-1 reference),
    // so the impact is heard 10 / 343.2 = 0.029 138 s late and the fall was that much shorter.
    const travel = { distance_to_release_m: 0, distance_to_landing_m: 10, speed_of_sound_m_s: speedOfSoundAt(20) };
    expect(correctForSoundTravel(1.5, travel, 10)).toBeCloseTo(1.5 - 0.029138, 6);
  });

  it('changes nothing when the phone is as far from both points', () => {
    const travel = { distance_to_release_m: 7.5, distance_to_landing_m: 7.5, speed_of_sound_m_s: 340 };
    expect(correctForSoundTravel(2.25, travel)).toBe(2.25);
  });

  it('refuses distances that differ by more than the drop height', () => {
    const travel = { distance_to_release_m: 20.5, distance_to_landing_m: 0, speed_of_sound_m_s: 343 };
    expect(() => correctForSoundTravel(2, travel, 20)).toThrow(TimingError);
    try {
      correctForSoundTravel(2, travel, 20);
    } catch (e) {
      const error = e as TimingError;
      expect(error.code).toBe('impossible-geometry');
      expect(error.value).toEqual({ distance_to_release_m: 20.5, distance_to_landing_m: 0, height_m: 20 });
      expect(error.message).toMatch(/differ by 20.5 m, more than the 20 m/);
    }
  });

  it('names the field, the value and the range of a bad distance, speed or temperature', () => {
    const ok = { distance_to_release_m: 5, distance_to_landing_m: 1, speed_of_sound_m_s: 343 };
    const codeOf = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        const error = e as TimingError;
        return [error.code, error.field, error.value, error.allowed];
      }
      return null;
    };
    expect(codeOf(() => soundTravelCorrection({ ...ok, distance_to_landing_m: -1 }))).toEqual(['out-of-range', 'distance_to_landing_m', -1, '0 to 1000 m']);
    expect(codeOf(() => soundTravelCorrection({ ...ok, distance_to_release_m: NaN }))).toEqual(['not-finite', 'distance_to_release_m', NaN, '0 to 1000 m']);
    expect(codeOf(() => soundTravelCorrection({ ...ok, speed_of_sound_m_s: 34.3 }))).toEqual(['out-of-range', 'speed_of_sound_m_s', 34.3, '250 to 420 m/s']);
    expect(codeOf(() => speedOfSoundAt(150))).toEqual(['out-of-range', 'temperature_C', 150, '-100 to 100 °C']);
    expect(codeOf(() => correctForSoundTravel(Infinity, ok))).toEqual(['not-finite', 'heard_s', Infinity, 'a finite time in seconds']);
  });
});

describe('the correction stored with a sound capture', () => {
  // The worked example above: 12 m drop, phone on the ground 3 m from the landing point, 10 °C.
  const travel = { distance_to_release_m: Math.sqrt(153), distance_to_landing_m: 3, speed_of_sound_m_s: speedOfSoundAt(10), temperature_C: 10 };

  it('holds its inputs and its value, computed once here', () => {
    const stored = soundTravelRecord(travel, 12);
    expect(stored).toEqual({ ...travel, correction_s: soundTravelCorrection(travel, 12) });
    expect(stored.correction_s).toBeCloseTo(0.027778, 6);
    expect(soundTravelRecord({ ...travel, temperature_C: undefined }).temperature_C).toBeNull();
  });

  it('lets a corrected drop be recomputed from its record alone: heard interval + stored correction', () => {
    const heard_s = 1.58;
    const raw = { kind: 'sound' as const, onsets_s: [0.75, 0.75 + heard_s], sample_rate_Hz: 44_100, sound_travel: soundTravelRecord(travel, 12) };
    const time_s = correctForSoundTravel(heard_s, travel, 12);
    expect(fallTimeFromSoundCapture(raw)).toBeCloseTo(time_s, 12);
    expect(fallTimeFromSoundCapture(raw)).toBeCloseTo(1.607778, 6);
    expect(fallTimeFromSoundCapture({ ...raw, sound_travel: null })).toBeCloseTo(heard_s, 12);
    // The record the drop entry writes with it is valid as it stands.
    const body = { series_id: '3f1c2a9e-5b7d-4e21-9c0a-1d2e3f405162', seq: 1, raw, time_s, height_m: null, excluded: false, exclusion_reason: null, note: '', captured_at: '2026-06-14T09:10:12.000Z' };
    expect(validateBody('drop', body)).toEqual([]);
  });

  it('refuses a capture without exactly two onsets, naming them', () => {
    const e = (() => {
      try {
        fallTimeFromSoundCapture({ kind: 'sound', onsets_s: [1], sample_rate_Hz: 44_100, sound_travel: null });
      } catch (error) {
        return error as TimingError;
      }
      throw new Error('expected a refusal');
    })();
    expect([e.code, e.field, e.value]).toEqual(['wrong-count', 'onsets_s', [1]]);
  });
});

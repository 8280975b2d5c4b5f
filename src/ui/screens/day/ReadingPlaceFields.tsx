import { inputRange, LIMITS } from '../../../log';
import { QField, type FieldState } from '../../forms';

/** The parts of a reading that say where it was taken and how the air moved. */
export interface ReadingPlaceDraft {
  /** Height above the landing surface; 0 is the landing surface itself. */
  readingHeight: FieldState;
  uWind: FieldState;
  verticalWind: FieldState;
  uVerticalWind: FieldState;
}

export const emptyReadingPlace = (): ReadingPlaceDraft => ({
  readingHeight: { value: 0, error: null },
  uWind: { value: null, error: null },
  verticalWind: { value: null, error: null },
  uVerticalWind: { value: null, error: null },
});

export const readingPlaceValid = (d: ReadingPlaceDraft): boolean =>
  d.readingHeight.value !== null && [d.readingHeight, d.uWind, d.verticalWind, d.uVerticalWind].every((f) => f.error === null);

/** The record fields they fill. */
export function readingPlaceBody(d: ReadingPlaceDraft) {
  return {
    height_m: d.readingHeight.value ?? 0,
    u_wind_speed_m_s: d.uWind.value,
    vertical_wind_m_s: d.verticalWind.value,
    u_vertical_wind_m_s: d.uVerticalWind.value,
  };
}

/**
 * Where the reading was taken and the draught. Closed by default: most readings are taken on the ground in still
 * air. A second reading at the release point is what a tall drop needs (the analysis interpolates between them).
 */
export function ReadingPlaceFields({ draft, onChange }: { draft: ReadingPlaceDraft; onChange(next: Partial<ReadingPlaceDraft>): void }) {
  const aloft = (draft.readingHeight.value ?? 0) > 0;
  const moving = draft.verticalWind.value !== null && draft.verticalWind.value !== 0;
  return (
    <details class="more" open={aloft || moving}>
      <summary>Where it was taken, and air motion</summary>
      <QField
        label="Height above the landing surface"
        kind="length"
        state={draft.readingHeight}
        {...inputRange(LIMITS.reading_height_m)}
        hint="0 on the ground. For drops from high up, take a second reading at the release point too."
        onChange={(readingHeight) => onChange({ readingHeight })}
      />
      <QField
        label="Vertical air motion (optional, + upward)"
        kind="speed"
        required={false}
        state={draft.verticalWind}
        {...inputRange(LIMITS.vertical_wind_m_s)}
        hint="A thermal, or a draught in a stairwell or a tower: it slows or speeds every fall."
        onChange={(verticalWind) => onChange({ verticalWind })}
      />
      <QField
        label="Its standard uncertainty (optional)"
        kind="speed"
        delta
        required={false}
        state={draft.uVerticalWind}
        {...inputRange(LIMITS.u_vertical_wind_m_s)}
        hint="Left empty, the analysis derives it from the recorded wind."
        onChange={(uVerticalWind) => onChange({ uVerticalWind })}
      />
      <QField
        label="Wind speed standard uncertainty (optional)"
        kind="speed"
        delta
        required={false}
        state={draft.uWind}
        {...inputRange(LIMITS.u_wind_speed_m_s)}
        hint="Left empty, the analysis derives it from the wind itself (gusts)."
        onChange={(uWind) => onChange({ uWind })}
      />
    </details>
  );
}

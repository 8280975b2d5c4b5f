import { inputRange, LIMITS, type ReadingRecord, type TimingMethod } from '../../../log';
import { TIMING_METHOD_DEFAULTS } from '../../../physics';
import { useApp } from '../../app-context';
import { QField, SelectField, type FieldState } from '../../forms';

/** The series' second reading (for tall drops) and its declared timing delay. */
export interface SeriesAirTimingDraft {
  readingAloftId: string;
  delay: FieldState;
  uDelay: FieldState;
}

export const emptySeriesAirTiming = (): SeriesAirTimingDraft => ({
  readingAloftId: '',
  delay: { value: null, error: null },
  uDelay: { value: null, error: null },
});

export const seriesAirTimingValid = (d: SeriesAirTimingDraft, readingId: string): boolean =>
  d.delay.error === null && d.uDelay.error === null && (d.readingAloftId === '' || d.readingAloftId !== readingId);

/** The record fields they fill: empty delay fields mean the timing method's own default. */
export function seriesAirTimingBody(d: SeriesAirTimingDraft) {
  return { reading_aloft_id: d.readingAloftId || null, timing_delay_s: d.delay.value, u_timing_delay_s: d.uDelay.value };
}

export function SeriesAirTimingFields({
  draft,
  method,
  readingId,
  readings,
  onChange,
}: {
  draft: SeriesAirTimingDraft;
  method: TimingMethod;
  readingId: string;
  readings: readonly ReadingRecord[];
  onChange(next: Partial<SeriesAirTimingDraft>): void;
}) {
  const { format } = useApp();
  const defaults = TIMING_METHOD_DEFAULTS[method];
  const defaultText = `${format(defaults.offset_s, 'time', 3)} ± ${format(defaults.offset_standard_uncertainty_s, 'time', 3)}`;
  const label = (r: ReadingRecord) =>
    `${new Date(r.taken_at).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })} · ${format(r.height_m, 'length', 0)} up · ${format(r.temperature_C, 'temperature')}`;
  return (
    <>
      <SelectField
        id="series-reading-aloft"
        label="Second reading, higher up (tall drops)"
        value={draft.readingAloftId}
        options={[{ value: '', label: 'None: the standard atmosphere above the reading' }, ...readings.filter((r) => r.id !== readingId).map((r) => ({ value: r.id, label: label(r) }))]}
        onChange={(readingAloftId) => onChange({ readingAloftId })}
      />
      <details class="more" open={draft.delay.value !== null || draft.uDelay.value !== null}>
        <summary>Steady timing delay: {draft.delay.value === null && draft.uDelay.value === null ? `method default ${defaultText}` : 'your own'}</summary>
        <p class="hint">
          A delay the same in every drop (measured minus true: a late start makes it negative). Left empty, the
          method’s default is used: {defaultText} (source: {defaults.source}).
        </p>
        <QField
          label="Delay (optional)"
          kind="time"
          delta
          required={false}
          state={draft.delay}
          {...inputRange(LIMITS.timing_delay_s)}
          onChange={(delay) => onChange({ delay })}
        />
        <QField
          label="Its standard uncertainty (optional)"
          kind="time"
          delta
          required={false}
          state={draft.uDelay}
          {...inputRange(LIMITS.u_timing_delay_s)}
          onChange={(uDelay) => onChange({ uDelay })}
        />
      </details>
    </>
  );
}

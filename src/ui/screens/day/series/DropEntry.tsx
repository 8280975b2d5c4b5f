// Entering one drop: the timer pad (taps or sound) or a typed time, kept as a draft until saved. One motion per
// drop: Enter (the keyboard's Next) adds it, focus stays in the time field, Add stays above the keyboard, and the
// saved drop is confirmed beside the field (and by a short vibration where the phone has one).
import { useRef, useState } from 'preact/hooks';
import { inputRange, LIMITS, type SeriesRecord } from '../../../../log';
import { tooFastTime } from '../../../../analysis';
import { tooFastText } from './verdict-text';
import { useApp } from '../../../app-context';
import { useDraft } from '../../../hooks';
import { Notice, QField, TextField, field, fieldsValid, type FieldState } from '../../../forms';
import { describeError } from '../../../errors';
import type { TimeCapturedDetail } from '../../../../widgets';
import { useUndo } from '../../../undo';
import { MarksEntry } from './MarksEntry';
import { lazyScreen } from '../../../lazy';

// Video timing loads with the first series timed by video: the first screen carries none of it.
const VideoEntry = lazyScreen(() => import('./VideoEntry').then((m) => m.VideoEntry), 'Loading video timing…');

interface DropDraft {
  time: FieldState;
  height: FieldState;
  otherHeight: boolean;
  note: string;
  /** The phone's capture behind `time`, kept until the drop is saved; null when the time was typed. */
  captured: TimeCapturedDetail['raw'] | null;
  /** Sound timing: the phone's distance to the release point and to the landing point. */
  releaseDistance: FieldState;
  landingDistance: FieldState;
}

/** A short buzz on a saved drop, where the phone has a vibration motor (ms). */
const SAVED_VIBRATION_MS = 30;

export function DropEntry({
  series,
  nextSeq,
  airTemperature,
  gravity,
}: {
  series: SeriesRecord;
  nextSeq: number;
  airTemperature: number | null;
  /** The site's gravity for the vacuum bound at entry; null when the site cannot give one (no check then). */
  gravity: number | null;
}) {
  const app = useApp();
  const key = `drop:${series.id}`;
  const form = useDraft<DropDraft>(key, () => ({
    time: field(),
    height: field(),
    otherHeight: false,
    note: '',
    captured: null,
    releaseDistance: field(series.height_m),
    landingDistance: field(1),
  }));
  const padMode = series.timing_method === 'sound' ? 'listen' : series.timing_method === 'tap' ? 'tap' : null;
  const [error, setError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);
  const [typedMarks, setTypedMarks] = useState(false);
  const input = useRef<HTMLElement>(null);
  const d = form.value;
  const valid = fieldsValid(d.time) && (!d.otherHeight || fieldsValid(d.height));

  const focusTime = () => (input.current?.querySelector('pl-quantity') as { focus?: () => void } | null)?.focus?.();
  const { offerUndo } = useUndo();

  /**
   * Saves the drop: the typed time (Enter or Add), or a capture from the timer pad passed in directly (Impact adds
   * the drop, with undo). A time no fall can make is refused here, before anything is stored.
   */
  const save = async (time = d.time, capture?: { time_s: number; raw: TimeCapturedDetail['raw'] }) => {
    if ((!capture && !fieldsValid(time)) || (d.otherHeight && !fieldsValid(d.height)) || saving) return;
    const time_s = capture ? capture.time_s : time.value!;
    const height = d.otherHeight && d.height.value !== null ? d.height.value : series.height_m;
    const tooFast = gravity !== null ? tooFastTime({ seq: nextSeq, time_s, height_m: height }, gravity) : null;
    if (tooFast) {
      setError(tooFastText(tooFast, app.format));
      setSaved(null);
      return;
    }
    setSaving(true);
    setError(null);
    try {
      const raw = capture ? capture.raw : (d.captured ?? { kind: 'typed' as const, text: time.text ?? String(time.value) });
      const drop = await app.store.create(
        'drop',
        {
          series_id: series.id,
          seq: nextSeq,
          raw,
          time_s,
          height_m: d.otherHeight ? d.height.value : null,
          excluded: false,
          exclusion_reason: null,
          note: d.note,
          captured_at: new Date().toISOString(),
        },
        { clearDraft: key },
      );
      await form.clear();
      form.replace({ ...d, time: { value: null, error: null, text: '' }, note: '', captured: null });
      offerUndo(`Drop ${drop.seq} added: ${app.format(time_s, 'time')}`, [drop]);
      app.notifyChanged();
      setSaved(`Drop ${drop.seq} saved: ${app.format(time_s, 'time')}${d.otherHeight ? ` from ${app.format(height, 'length', 2)}` : ''}`);
      navigator.vibrate?.(SAVED_VIBRATION_MS);
      focusTime();
    } catch (e) {
      setError(describeError(e));
    } finally {
      setSaving(false);
    }
  };

  // Marks along the fall: always for a gates series, on request for any other (typed distance/time pairs).
  if (series.gate_distances_m || typedMarks) {
    return (
      <section class="card entry" aria-labelledby="entry-h">
        <h3 id="entry-h">Drop {nextSeq}</h3>
        <MarksEntry series={series} nextSeq={nextSeq} />
        {series.gate_distances_m ? null : (
          <label class="check">
            <input type="checkbox" checked onChange={() => setTypedMarks(false)} />
            <span>Several marks along the fall</span>
          </label>
        )}
      </section>
    );
  }

  const typedForm = (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      {padMode ? (
        <>
          {padMode === 'listen' ? (
            <div class="two">
              <QField label="Phone to release point" kind="length" compact state={d.releaseDistance} {...inputRange(LIMITS.sound_distance_m)} onChange={(releaseDistance) => form.set({ releaseDistance })} />
              <QField label="Phone to landing point" kind="length" compact state={d.landingDistance} {...inputRange(LIMITS.sound_distance_m)} onChange={(landingDistance) => form.set({ landingDistance })} />
            </div>
          ) : null}
          <pl-timer-pad
            label={`Drop ${nextSeq} timer`}
            mode={padMode}
            releaseHeight={d.otherHeight && d.height.value !== null ? d.height.value : series.height_m}
            releaseDistance={d.releaseDistance.value ?? undefined}
            landingDistance={d.landingDistance.value ?? undefined}
            airTemperature={airTemperature ?? undefined}
            decimalComma={app.settings.decimalComma}
            units={app.settings.units}
            ontime-captured={(e: CustomEvent<TimeCapturedDetail>) => {
              // The capture carries its sound-travel correction as data (raw.sound_travel).
              // Impact adds the drop at once; the undo bar takes it back if the tap was a slip.
              void save(d.time, { time_s: e.detail.time_s, raw: e.detail.raw });
            }}
          />
        </>
      ) : null}
      <div ref={input as never}>
        <QField
          label="Fall time"
          kind="time"
          state={d.time}
          {...inputRange(LIMITS.time_s)}
          enterHint="next"
          hint={d.captured ? `Captured by the phone (${d.captured.kind === 'sound' ? 'sound onsets' : 'taps'}); typing a new value replaces it.` : undefined}
          onChange={(time) => {
            form.set({ time, captured: null });
            if (error) setError(null);
          }}
          onEnter={(time) => void save(time)}
        />
      </div>
      <div class="entry-bar">
        {error ? <Notice tone="bad">{error}</Notice> : null}
        <button type="submit" class="btn btn-block btn-big" disabled={!valid || saving}>
          Add drop {nextSeq}
        </button>
        <p class="entry-saved" role="status" aria-live="polite" data-testid="drop-saved">
          {saved ? `✓ ${saved}` : ''}
        </p>
      </div>
      <label class="check">
        <input type="checkbox" checked={d.otherHeight} onChange={(e) => form.set({ otherHeight: (e.target as HTMLInputElement).checked })} />
        <span>Dropped from another height</span>
      </label>
      {d.otherHeight ? (
        <QField label="Height of this drop" kind="length" state={d.height} {...inputRange(LIMITS.height_m)} onChange={(height) => form.set({ height })} />
      ) : null}
      <label class="check">
        <input type="checkbox" checked={false} onChange={() => setTypedMarks(true)} />
        <span>Several marks along the fall</span>
      </label>
      <TextField id="drop-note" label="Note (optional)" value={d.note} onInput={(note) => form.set({ note })} />
    </form>
  );

  return (
    <section class="card entry" aria-labelledby="entry-h">
      <h3 id="entry-h">Drop {nextSeq}</h3>
      {series.timing_method === 'video' ? <VideoEntry series={series} nextSeq={nextSeq} releaseHeight={d.otherHeight && d.height.value !== null ? d.height.value : series.height_m} /> : null}
      {series.timing_method === 'video' ? (
        // A video series times its drops from clips; typing stays possible (a clip lost, a time from elsewhere).
        <details class="row-details typed-fallback">
          <summary>Type a fall time, or set another release height</summary>
          {typedForm}
        </details>
      ) : (
        typedForm
      )}
    </section>
  );
}

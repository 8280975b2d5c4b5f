import { useMemo, useState } from 'preact/hooks';
import { typedAirProperties } from '../../../analysis';
import { inputRange, LIMITS, type SiteRecord } from '../../../log';
import { useApp } from '../../app-context';
import { useDraft } from '../../hooks';
import { Choice, MeasuredField, Notice, QField, TextField, field, fieldsValid, type FieldState } from '../../forms';
import { describeError } from '../../errors';
import { emptyReadingPlace, readingPlaceBody, readingPlaceValid, ReadingPlaceFields, type ReadingPlaceDraft } from './ReadingPlaceFields';
import { inChosenUnits, warningText } from '../../unit-text';

interface ReadingDraft extends ReadingPlaceDraft {
  temperature: FieldState;
  uTemperature: FieldState;
  pressure: FieldState;
  uPressure: FieldState;
  reference: 'station' | 'sea_level' | '';
  humidityKind: 'relative' | 'dew_point';
  humidity: FieldState;
  dewPoint: FieldState;
  uHumidity: FieldState;
  uDewPoint: FieldState;
  wind: FieldState;
  instrument: string;
  notes: string;
  /** When the air was read, as the phone's local "YYYY-MM-DDTHH:MM"; empty: now, when saved. */
  takenAt?: string;
}

/** The live air figures for what has been typed so far (or why there are none yet). */
function useAirPreview(d: ReadingDraft, site: SiteRecord | null) {
  return useMemo(() => {
    const humidityOk = d.humidityKind === 'relative' ? fieldsValid(d.humidity) : fieldsValid(d.dewPoint);
    if (!fieldsValid(d.temperature, d.pressure) || !humidityOk || d.reference === '') return null;
    try {
      return typedAirProperties(
        {
          temperature_C: d.temperature.value!,
          pressure_Pa: d.pressure.value!,
          pressure_reference: d.reference,
          ...(d.humidityKind === 'relative' ? { relative_humidity_pct: d.humidity.value! } : { dew_point_C: d.dewPoint.value! }),
        },
        site,
      );
    } catch (e) {
      return { ok: false as const, message: describeError(e) };
    }
  }, [d, site]);
}

export function ReadingForm({ dayId, site, onDone }: { dayId: string; site: SiteRecord | null; onDone(): void }) {
  const app = useApp();
  const key = `reading:${dayId}`;
  const form = useDraft<ReadingDraft>(key, () => ({
    temperature: field(),
    uTemperature: field(0.3),
    pressure: field(),
    uPressure: field(50),
    reference: '',
    humidityKind: 'relative',
    humidity: field(),
    dewPoint: field(),
    uHumidity: field(3),
    uDewPoint: field(0.5),
    wind: { value: null, error: null },
    instrument: '',
    notes: '',
    ...emptyReadingPlace(),
  }));
  const d = form.value;
  const preview = useAirPreview(d, site);
  const [error, setError] = useState<string | null>(null);
  const valid = preview?.ok === true && fieldsValid(d.uTemperature, d.uPressure) && (d.humidityKind === 'relative' ? fieldsValid(d.uHumidity) : fieldsValid(d.uDewPoint)) && d.wind.error === null && readingPlaceValid(d);

  const save = async () => {
    setError(null);
    try {
      await app.store.create(
        'reading',
        {
          day_id: dayId,
          taken_at: d.takenAt ? new Date(d.takenAt).toISOString() : new Date().toISOString(),
          temperature_C: d.temperature.value!,
          u_temperature_C: d.uTemperature.value!,
          pressure_Pa: d.pressure.value!,
          u_pressure_Pa: d.uPressure.value!,
          pressure_reference: d.reference as 'station' | 'sea_level',
          humidity:
            d.humidityKind === 'relative'
              ? { kind: 'relative', relative_humidity_pct: d.humidity.value!, u_relative_humidity_pct: d.uHumidity.value! }
              : { kind: 'dew_point', dew_point_C: d.dewPoint.value!, u_dew_point_C: d.uDewPoint.value! },
          wind_speed_m_s: d.wind.value,
          ...readingPlaceBody(d),
          instrument: d.instrument,
          notes: d.notes,
        },
        { clearDraft: key },
      );
      await form.clear();
      app.notifyChanged();
      onDone();
    } catch (e) {
      setError(describeError(e));
    }
  };

  return (
    <section class="card" aria-labelledby="reading-h">
      <h3 id="reading-h">New air reading</h3>
      {form.restored ? <Notice tone="info">Your unsaved entries were brought back.</Notice> : null}
      <MeasuredField form={form} name="temperature" uName="uTemperature" label="Air temperature" kind="temperature" {...inputRange(LIMITS.temperature_C)} uMax={LIMITS.u_temperature_C.max} />
      <MeasuredField form={form} name="pressure" uName="uPressure" label="Air pressure" kind="pressure" {...inputRange(d.reference === 'sea_level' ? LIMITS.sea_level_pressure_Pa : LIMITS.station_pressure_Pa)} uMax={LIMITS.u_pressure_Pa.max} />
      <Choice
        legend="Where this pressure comes from"
        name="pref"
        stacked
        value={d.reference}
        options={[
          { value: 'station', label: 'Read on site: the air pressure where we stand' },
          { value: 'sea_level', label: 'A weather report: brought down to sea level' },
        ]}
        onChange={(reference) => form.set({ reference })}
        hint="Weather services publish pressure brought down to sea level; the app takes it back up to the site’s elevation."
      />
      <Choice
        legend="Humidity as"
        name="hkind"
        value={d.humidityKind}
        options={[
          { value: 'relative', label: 'Relative humidity' },
          { value: 'dew_point', label: 'Dew point' },
        ]}
        onChange={(humidityKind) => form.set({ humidityKind })}
      />
      {d.humidityKind === 'relative' ? (
        <MeasuredField form={form} name="humidity" uName="uHumidity" label="Relative humidity" kind="percent" {...inputRange(LIMITS.relative_humidity_pct)} uMax={LIMITS.u_relative_humidity_pct.max} />
      ) : (
        <MeasuredField form={form} name="dewPoint" uName="uDewPoint" label="Dew point" kind="temperature" {...inputRange(LIMITS.dew_point_C)} uMax={LIMITS.u_dew_point_C.max} />
      )}
      <QField label="Wind speed (optional)" kind="speed" required={false} state={d.wind} {...inputRange(LIMITS.wind_speed_m_s)} onChange={(wind) => form.set({ wind })} />
      <ReadingPlaceFields draft={d} onChange={(next) => form.set(next)} />
      <TextField id="instrument" label="Instrument" value={d.instrument} onInput={(instrument) => form.set({ instrument })} />
      <div class="field">
        <label for="reading-time">Time of the reading</label>
        <input id="reading-time" type="datetime-local" value={d.takenAt ?? ''} aria-describedby="reading-time-hint" onInput={(e) => form.set({ takenAt: (e.target as HTMLInputElement).value })} />
        <div class="hint" id="reading-time-hint">
          Empty: now. A reading typed in later keeps the time the air was read; each series uses the reading nearest its start.
        </div>
      </div>
      <AirFigures preview={preview} />
      {error ? <Notice tone="bad">{error}</Notice> : null}
      <div class="btn-row">
        <button type="button" class="btn" disabled={!valid} onClick={save}>
          Save reading
        </button>
        <button type="button" class="btn btn-quiet" onClick={onDone}>
          Close
        </button>
      </div>
    </section>
  );
}

function AirFigures({ preview }: { preview: ReturnType<typeof useAirPreview> }) {
  const { format } = useApp();
  if (!preview) return <p class="hint">Air density, viscosity and the speed of sound show here as soon as the reading is complete.</p>;
  if (!preview.ok) return <Notice tone="bad">{inChosenUnits(preview.message, format)}</Notice>;
  const a = preview.air;
  return (
    <div class="figures" aria-live="polite">
      <div class="figure">
        <span class="figure-label">Air density</span>
        <span class="figure-value">{format(a.density_kg_m3, 'density')}</span>
      </div>
      <div class="figure">
        <span class="figure-label">Viscosity</span>
        <span class="figure-value">{format(a.dynamic_viscosity_Pa_s, 'viscosity')}</span>
      </div>
      <div class="figure">
        <span class="figure-label">Speed of sound</span>
        <span class="figure-value">{format(a.speed_of_sound_m_s, 'speed', 1)}</span>
      </div>
      <div class="figure">
        <span class="figure-label">Pressure on site</span>
        <span class="figure-value">{format(a.station_pressure_Pa, 'pressure')}</span>
      </div>
      {a.warnings.map((w) => (
        <Notice key={w.code} tone="warn">
          {warningText(w, format, { temperature_C: a.temperature_K - 273.15, station_pressure_Pa: a.station_pressure_Pa })}
        </Notice>
      ))}
    </div>
  );
}

import { useState } from 'preact/hooks';
import { useApp } from '../../app-context';
import { useDraft, useStoreData } from '../../hooks';
import { Choice, Notice, QField, SelectField, TextField, field, fieldsValid, type FieldState } from '../../forms';
import { navigate } from '../../router';
import { inputRange, LIMITS, type SiteBody } from '../../../log';
import { describeError } from '../../errors';
import { localDate } from '../../dates';

interface StartDayDraft {
  siteId: string; // '' = a new site
  name: string;
  latitude: FieldState;
  longitude: FieldState;
  elevation: FieldState;
  elevationSource: SiteBody['elevation_source'];
  siteNotes: string;
  date: string;
  crew: string;
  notes: string;
}


export function StartDayForm() {
  const app = useApp();
  const sites = useStoreData(() => app.store.list('site'), []);
  const form = useDraft<StartDayDraft>('start-day', () => ({
    siteId: '',
    name: '',
    latitude: field(),
    longitude: field(),
    elevation: field(),
    elevationSource: 'map',
    siteNotes: '',
    date: localDate(),
    crew: '',
    notes: '',
  }));
  const [locating, setLocating] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const f = form.value;
  const newSite = f.siteId === '';
  const siteList = sites.state === 'ready' ? [...sites.value].sort((a, b) => a.name.localeCompare(b.name)) : [];
  const dateOk = /^\d{4}-\d{2}-\d{2}$/.test(f.date);
  const valid = dateOk && (!newSite || (f.name.trim() !== '' && fieldsValid(f.latitude, f.longitude, f.elevation)));

  const locate = () => {
    if (!('geolocation' in navigator)) {
      setLocating('This browser cannot read the phone’s location. Type the coordinates.');
      return;
    }
    setLocating('Reading the phone’s location…');
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        const { latitude, longitude, altitude } = pos.coords;
        form.set({
          latitude: { value: latitude, error: null, text: latitude.toFixed(5) },
          longitude: { value: longitude, error: null, text: longitude.toFixed(5) },
          ...(altitude !== null ? { elevation: { value: altitude, error: null }, elevationSource: 'gps' as const } : {}),
        });
        setLocating(
          altitude === null
            ? 'Position filled in. The phone gave no elevation: take it from a map or a survey.'
            : 'Position filled in. GPS elevation is rough (often ±10–30 m): a surveyed or map value is better.',
        );
      },
      (err) => setLocating(`No location: ${err.message}. Type the coordinates.`),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  };

  const save = async () => {
    setError(null);
    try {
      const siteId = newSite ? app.store.newId() : f.siteId;
      const dayId = app.store.newId();
      await app.store.commit(
        [
          ...(newSite
            ? [
                {
                  op: 'create' as const,
                  kind: 'site' as const,
                  id: siteId,
                  body: {
                    name: f.name.trim(),
                    latitude_deg: f.latitude.value!,
                    longitude_deg: f.longitude.value!,
                    elevation_m: f.elevation.value!,
                    elevation_source: f.elevationSource,
                    notes: f.siteNotes,
                  },
                },
              ]
            : []),
          {
            op: 'create' as const,
            kind: 'day' as const,
            id: dayId,
            body: {
              site_id: siteId,
              date: f.date,
              crew: f.crew.split(',').map((c) => c.trim()).filter(Boolean),
              notes: f.notes,
            },
          },
        ],
        { clearDraft: 'start-day' },
      );
      await form.clear();
      await app.updateSettings({ currentDayId: dayId });
      app.notifyChanged();
      navigate('day', dayId);
    } catch (e) {
      setError(describeError(e));
    }
  };

  return (
    <section aria-labelledby="start-h" class="card">
      <h2 id="start-h">Start a test day</h2>
      {form.restored ? <Notice tone="info">Your unsaved entries were brought back.</Notice> : null}
      <SelectField
        id="site-pick"
        label="Site"
        value={f.siteId}
        options={[{ value: '', label: 'A new site…' }, ...siteList.map((s) => ({ value: s.id, label: s.name }))]}
        onChange={(siteId) => form.set({ siteId })}
      />
      {newSite ? (
        <div class="subform">
          <TextField id="site-name" label="Site name" value={f.name} required onInput={(name) => form.set({ name })} />
          <button type="button" class="btn btn-quiet btn-block" onClick={locate}>
            Fill in from the phone’s location
          </button>
          {locating ? <p class="hint" role="status">{locating}</p> : null}
          <div class="two">
            <QField label="Latitude" kind="angle" hemispheres="NS" hint={`46.1083 or 46°06'30" N`} state={f.latitude} {...inputRange(LIMITS.latitude_deg)} onChange={(latitude) => form.set({ latitude })} compact />
            <QField label="Longitude" kind="angle" hemispheres="EW" hint={`-8.25 or 8°15' W`} state={f.longitude} {...inputRange(LIMITS.longitude_deg)} onChange={(longitude) => form.set({ longitude })} compact />
          </div>
          <QField
            label="Elevation"
            kind="length"
            state={f.elevation}
            {...inputRange(LIMITS.elevation_m)}
            hint="Height above sea level of the landing surface."
            onChange={(elevation) => form.set({ elevation })}
          />
          <Choice
            legend="Elevation from"
            name="elev-src"
            value={f.elevationSource}
            options={[
              { value: 'survey', label: 'Survey' },
              { value: 'map', label: 'Map' },
              { value: 'gps', label: 'GPS' },
              { value: 'other', label: 'Other' },
            ]}
            onChange={(elevationSource) => form.set({ elevationSource })}
            hint={f.elevationSource === 'gps' ? 'GPS elevation is rough; gravity changes by 0.3 mm/s² per 100 m.' : undefined}
          />
          <TextField id="site-notes" label="Site notes" value={f.siteNotes} multiline onInput={(siteNotes) => form.set({ siteNotes })} />
        </div>
      ) : null}
      <div class="field">
        <label for="day-date">Date</label>
        <input id="day-date" type="date" value={f.date} onInput={(e) => form.set({ date: (e.target as HTMLInputElement).value })} />
        {!dateOk ? <div class="error" role="alert">Date: “{f.date}” is not a date (YYYY-MM-DD).</div> : null}
      </div>
      <TextField id="day-crew" label="Crew" hint="Names, separated by commas." value={f.crew} onInput={(crew) => form.set({ crew })} />
      <TextField id="day-notes" label="Notes" value={f.notes} multiline onInput={(notes) => form.set({ notes })} />
      {error ? <Notice tone="bad">{error}</Notice> : null}
      <button type="button" class="btn btn-block" disabled={!valid} onClick={save}>
        Start the day
      </button>
      {!valid ? <p class="hint">Fill in the site name, its position and elevation, and the date.</p> : null}
    </section>
  );
}

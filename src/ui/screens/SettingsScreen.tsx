import { useState } from 'preact/hooks';
import { useApp } from '../app-context';
import { useStoreData } from '../hooks';
import { Choice, Notice, SelectField } from '../forms';
import { CHOOSABLE, UNITS, UNIT_SYSTEMS, unitSystemOf, type QuantityKind } from '../../widgets/units';
import { loadSampleLog, removeSampleLog } from '../sample-log';
import { describeError } from '../errors';
import { RiskWarnings } from '../RiskWarnings';

const UNIT_LABELS: Partial<Record<QuantityKind, string>> = {
  length: 'Heights and distances',
  smallLength: 'Specimen sizes',
  temperature: 'Temperature',
  pressure: 'Pressure',
  mass: 'Mass',
  speed: 'Speed',
  energy: 'Energy',
  area: 'Area',
  volume: 'Volume',
  density: 'Air density',
  acceleration: 'Gravity',
  viscosity: 'Air viscosity',
};

function bytes(n: number | null): string {
  if (n === null) return 'unknown';
  if (n < 1e6) return `${(n / 1e3).toFixed(0)} kB`;
  if (n < 1e9) return `${(n / 1e6).toFixed(1)} MB`;
  return `${(n / 1e9).toFixed(2)} GB`;
}

export function SettingsScreen() {
  const app = useApp();
  const [message, setMessage] = useState<string | null>(null);
  const device = useStoreData(() => app.store.deviceId(), []);
  const s = app.status;
  const sampleIds = app.settings.sampleIds;

  const loadSample = async () => {
    setMessage(null);
    try {
      const ids = await loadSampleLog(app.store);
      await app.updateSettings({ sampleIds: ids });
      app.notifyChanged();
      setMessage('The sample log is loaded: see the Log tab. Every record in it is marked “(sample)”.');
    } catch (e) {
      setMessage(describeError(e));
    }
  };
  const removeSample = async () => {
    setMessage(null);
    try {
      await removeSampleLog(app.store, sampleIds);
      await app.updateSettings({ sampleIds: [] });
      app.notifyChanged();
      setMessage('The sample log is removed.');
    } catch (e) {
      setMessage(describeError(e));
    }
  };

  return (
    <div>
      <section class="card" aria-labelledby="units-h">
        <h2 id="units-h">Units</h2>
        <p class="hint">Values are always stored in SI units; this only changes what is shown and typed.</p>
        <Choice
          legend="Show and type values in"
          name="unit-system"
          value={unitSystemOf(app.settings.units)}
          options={[
            { value: 'si', label: 'SI (m, °C, hPa)' },
            { value: 'us', label: 'US customary (ft, °F, inHg)' },
            ...(unitSystemOf(app.settings.units) === 'own' ? [{ value: 'own' as const, label: 'My own mix' }] : []),
          ]}
          onChange={(system) => {
            if (system !== 'own') void app.updateSettings({ units: { ...UNIT_SYSTEMS[system] } });
          }}
        />
        <details class="unit-kinds">
          <summary>Choose the unit of each quantity</summary>
          {CHOOSABLE.map((kind) => (
            <SelectField
              key={kind}
              id={`unit-${kind}`}
              label={UNIT_LABELS[kind] ?? kind}
              value={app.unit(kind)}
              options={UNITS[kind].map((u) => ({ value: u.symbol, label: `${u.symbol} (${u.name})` }))}
              onChange={(symbol) => void app.updateSettings({ units: { [kind]: symbol } })}
            />
          ))}
        </details>
        <label class="check">
          <input type="checkbox" checked={app.settings.decimalComma} onChange={(e) => void app.updateSettings({ decimalComma: (e.target as HTMLInputElement).checked })} />
          <span>Show numbers with a decimal comma (a comma is always accepted when typing)</span>
        </label>
      </section>
      <section class="card" aria-labelledby="theme-h">
        <h2 id="theme-h">Display</h2>
        <SelectField
          id="theme"
          label="Theme"
          value={app.settings.theme}
          options={[
            { value: 'daylight', label: 'Daylight, high contrast' },
            { value: 'dark', label: 'Dark' },
          ]}
          onChange={(theme) => void app.updateSettings({ theme: theme as 'daylight' | 'dark' })}
        />
      </section>
      <section class="card" aria-labelledby="storage-h">
        <h2 id="storage-h">Storage on this phone</h2>
        <RiskWarnings compact />
        <dl class="facts">
          <dt>Kept by the browser</dt>
          <dd>{s?.persistent === true ? 'yes (persistent storage granted)' : s?.persistent === false ? 'not promised' : 'unknown'}</dd>
          <dt>Installed</dt>
          <dd>{s?.installed === true ? 'yes' : s?.installed === false ? 'no, running in a browser tab' : 'unknown'}</dd>
          <dt>Used</dt>
          <dd>
            {bytes(s?.usage_bytes ?? null)} of {bytes(s?.quota_bytes ?? null)}
          </dd>
          <dt>Last export or sync</dt>
          <dd>{s?.lastSentAt ? new Date(s.lastSentAt).toLocaleString() : 'never'}</dd>
          <dt>Changes since</dt>
          <dd>{s?.unsentChanges ?? 0}</dd>
          <dt>This phone’s id</dt>
          <dd class="mono">{device.state === 'ready' ? device.value : '…'}</dd>
        </dl>
        {s?.persistent !== true ? (
          <button
            type="button"
            class="btn btn-quiet"
            onClick={async () => {
              const granted = await app.store.requestPersistence();
              await app.refreshStatus();
              setMessage(granted ? 'The browser will keep Plummet’s data.' : 'The browser did not promise to keep the data. Installing the app usually helps.');
            }}
          >
            Ask the browser to keep the data
          </button>
        ) : null}
      </section>
      <section class="card" aria-labelledby="sample-h">
        <h2 id="sample-h">Sample log</h2>
        <p>An invented test day of our own, to see what a finished day looks like. Every record in it is marked “(sample)”.</p>
        {sampleIds.length ? (
          <button type="button" class="btn btn-quiet" onClick={removeSample}>
            Remove the sample log
          </button>
        ) : (
          <button type="button" class="btn btn-quiet" onClick={loadSample}>
            Load the sample log
          </button>
        )}
      </section>
      {message ? <Notice tone="info">{message}</Notice> : null}
      <p class="hint about">
        Plummet {__APP_VERSION__} · build <span data-testid="build-id">{__BUILD_ID__}</span>
      </p>
    </div>
  );
}

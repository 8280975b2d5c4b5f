import { createContext, type ComponentChildren } from 'preact';
import { useCallback, useContext, useEffect, useMemo, useRef, useState } from 'preact/hooks';
import type { LogStore, StoreStatus } from '../store';
import { DEFAULT_UNITS, formatQuantity, type QuantityKind, type UnitChoice } from '../widgets/units';

/** What the crew chooses in Settings; stored in the store's meta under "settings". */
export interface AppSettings {
  units: UnitChoice;
  theme: 'daylight' | 'dark';
  /** Show and accept a decimal comma. Typing a comma is accepted either way. */
  decimalComma: boolean;
  /** The safety caution was read for this day id (shown again for each new day). */
  cautionSeenForDay: string | null;
  /** The day the "Test day" tab opens on. */
  currentDayId: string | null;
  /** The ids the sample log wrote, so it can be removed again. */
  sampleIds: string[];
  /** How the log last left the Send screen as a file: handed to another app, or saved on this phone only. */
  lastHandoff: { how: 'shared' | 'saved'; at: string } | null;
}

export const DEFAULT_SETTINGS: AppSettings = {
  units: { ...DEFAULT_UNITS },
  theme: 'daylight',
  decimalComma: false,
  cautionSeenForDay: null,
  currentDayId: null,
  sampleIds: [],
  lastHandoff: null,
};

export interface AppServices {
  store: LogStore;
  settings: AppSettings;
  updateSettings(patch: Partial<AppSettings>): Promise<void>;
  /** Bumped after every write, so screens reload what they show. */
  changes: number;
  notifyChanged(): void;
  status: StoreStatus | null;
  refreshStatus(): Promise<void>;
  unit(kind: QuantityKind): string;
  /** An SI value as text in the crew's unit, e.g. "12.40 m". */
  format(valueSI: number | null | undefined, kind: QuantityKind, decimals?: number): string;
}

const AppContext = createContext<AppServices | null>(null);

export function useApp(): AppServices {
  const app = useContext(AppContext);
  if (!app) throw new Error('useApp() outside <AppProvider>');
  return app;
}

function applyTheme(theme: AppSettings['theme']) {
  document.documentElement.dataset.theme = theme;
  document.querySelector('meta[name="theme-color"]')?.setAttribute('content', theme === 'dark' ? '#0e1412' : '#0b3d2e');
}

export function AppProvider({
  store,
  initialSettings,
  initialStatus,
  children,
  onReady,
}: {
  store: LogStore;
  initialSettings: AppSettings;
  /** The store's status read before the first render, so the app does not render twice to show it. */
  initialStatus?: StoreStatus;
  children: ComponentChildren;
  /** Hands out the change notifier to code outside the tree (the sync service). */
  onReady?: (notifyChanged: () => void) => void;
}) {
  const [settings, setSettings] = useState(initialSettings);
  const [changes, setChanges] = useState(0);
  const [status, setStatus] = useState<StoreStatus | null>(initialStatus ?? null);
  const statusFresh = useRef(initialStatus !== undefined);

  const refreshStatus = useCallback(async () => {
    setStatus(await store.status());
  }, [store]);

  useEffect(() => {
    onReady?.(() => setChanges((c) => c + 1));
  }, [onReady]);

  useEffect(() => {
    applyTheme(settings.theme);
  }, [settings.theme]);

  useEffect(() => {
    if (statusFresh.current) {
      statusFresh.current = false;
      return;
    }
    void refreshStatus();
  }, [changes, refreshStatus]);

  const services = useMemo<AppServices>(
    () => ({
      store,
      settings,
      async updateSettings(patch) {
        const next = { ...settings, ...patch, units: { ...settings.units, ...(patch.units ?? {}) } };
        setSettings(next);
        await store.setMeta('settings', next as unknown as Record<string, unknown>);
      },
      changes,
      notifyChanged: () => setChanges((c) => c + 1),
      status,
      refreshStatus,
      unit: (kind) => settings.units[kind] ?? DEFAULT_UNITS[kind],
      format: (value, kind, decimals) =>
        formatQuantity(value, kind, settings.units, { decimalComma: settings.decimalComma, ...(decimals !== undefined ? { decimals } : {}) }),
    }),
    [store, settings, changes, status, refreshStatus],
  );
  return <AppContext.Provider value={services}>{children}</AppContext.Provider>;
}

export async function loadSettings(store: LogStore): Promise<AppSettings> {
  const saved = (await store.getMeta('settings')) as Partial<AppSettings> | undefined;
  return { ...DEFAULT_SETTINGS, ...saved, units: { ...DEFAULT_SETTINGS.units, ...(saved?.units ?? {}) } };
}

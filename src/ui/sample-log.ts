// The sample log: an invented scenario of our own (site, specimens, readings and times), marked as a sample
// everywhere it shows and removable. Times come from our own fall model with an assumed drag coefficient and a
// small, seeded scatter, so they are physically plausible without being anyone's measurements.
import { airProperties, createRandom, fallParameters, fallTime, geometryFromDimensions, localGravity } from '../physics';
import type { LogStore, LogAction } from '../store';
import type { SpecimenBody } from '../log';

const SAMPLE_MARK = '(sample)';

interface SampleSeries {
  specimen: number;
  height_m: number;
  cd: number;
  count: number;
  extraHeights?: number[];
  u_time_s: number;
  method: 'tap' | 'sound' | 'video';
}

const SPECIMENS: SpecimenBody[] = [
  {
    name: `Hollow rubber ball 70 mm ${SAMPLE_MARK}`,
    mass_kg: 0.0582,
    u_mass_kg: 0.0002,
    shape: { kind: 'sphere', diameter_m: 0.0702, u_diameter_m: 0.0003 },
    reference_drag_coefficient: null,
    notes: 'Sample log: invented data.',
  },
  {
    name: `Foam cube 80 mm ${SAMPLE_MARK}`,
    mass_kg: 0.0215,
    u_mass_kg: 0.0002,
    shape: { kind: 'box', length_m: 0.08, u_length_m: 0.0005, width_m: 0.08, u_width_m: 0.0005, height_m: 0.08, u_height_m: 0.0005 },
    reference_drag_coefficient: 1.05,
    notes: 'Sample log: invented data.',
  },
  {
    name: `Plywood disc 150 mm ${SAMPLE_MARK}`,
    mass_kg: 0.094,
    u_mass_kg: 0.0005,
    shape: { kind: 'disc', diameter_m: 0.15, u_diameter_m: 0.0005, thickness_m: 0.009, u_thickness_m: 0.0003 },
    reference_drag_coefficient: 1.17,
    notes: 'Sample log: invented data.',
  },
];

const SITE = { lat: 46.208, elev: 541, temperature_C: 18.4, pressure_Pa: 95_310, rh: 62 };

const SERIES: SampleSeries[] = [
  { specimen: 0, height_m: 14.2, cd: 0.47, count: 6, u_time_s: 0.004, method: 'sound' },
  { specimen: 1, height_m: 14.2, cd: 1.12, count: 5, u_time_s: 0.03, method: 'tap' },
  { specimen: 2, height_m: 6.1, cd: 1.2, count: 5, extraHeights: [9.8, 14.2], u_time_s: 0.006, method: 'video' },
];

function dims(s: SpecimenBody): number[] {
  const sh = s.shape;
  switch (sh.kind) {
    case 'sphere':
      return [sh.diameter_m];
    case 'box':
      return [sh.length_m, sh.width_m, sh.height_m];
    case 'disc':
      return [sh.diameter_m, sh.thickness_m];
    case 'cylinder':
      return [sh.diameter_m, sh.length_m];
    case 'custom':
      return [sh.area_m2, sh.volume_m3];
  }
}

/** Writes the sample log in one transaction and returns the ids it wrote. */
export async function loadSampleLog(store: LogStore, now = new Date()): Promise<string[]> {
  const rand = createRandom(20260614);
  const gauss = () => rand.normal();
  const siteId = store.newId();
  const dayId = store.newId();
  const readingId = store.newId();
  const day = new Date(now.getTime() - 3 * 86_400_000);
  const date = day.toISOString().slice(0, 10);
  const at = (h: number, m: number) => `${date}T${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}:00.000Z`;
  const air = airProperties({ temperature_C: SITE.temperature_C, pressure_Pa: SITE.pressure_Pa, pressure_reference: 'station', relative_humidity_pct: SITE.rh }, SITE.elev);
  const g = localGravity({ latitude_deg: SITE.lat, elevation_m: SITE.elev }).gravity_m_s2;
  const actions: LogAction[] = [
    {
      op: 'create',
      kind: 'site',
      id: siteId,
      body: {
        name: `Larch Hill test tower ${SAMPLE_MARK}`,
        latitude_deg: SITE.lat,
        longitude_deg: 6.143,
        elevation_m: SITE.elev,
        elevation_source: 'map',
        notes: 'Sample log: an invented site and invented data, to show what a finished day looks like.',
      },
    },
    { op: 'create', kind: 'day', id: dayId, body: { site_id: siteId, date, crew: ['A. Sample', 'B. Example'], notes: 'Sample day: invented data.' } },
    {
      op: 'create',
      kind: 'reading',
      id: readingId,
      body: {
        day_id: dayId,
        taken_at: at(8, 40),
        temperature_C: SITE.temperature_C,
        u_temperature_C: 0.3,
        pressure_Pa: SITE.pressure_Pa,
        u_pressure_Pa: 40,
        pressure_reference: 'station',
        humidity: { kind: 'relative', relative_humidity_pct: SITE.rh, u_relative_humidity_pct: 3 },
        wind_speed_m_s: 1.2,
        u_wind_speed_m_s: null,
        vertical_wind_m_s: null,
        u_vertical_wind_m_s: null,
        height_m: 0,
        instrument: 'Handheld weather meter (sample)',
        notes: '',
      },
    },
  ];
  const ids = [siteId, dayId, readingId];
  const specimenIds = SPECIMENS.map(() => store.newId());
  SPECIMENS.forEach((body, i) => actions.push({ op: 'create', kind: 'specimen', id: specimenIds[i]!, body }));
  ids.push(...specimenIds);
  SERIES.forEach((s, k) => {
    const seriesId = store.newId();
    ids.push(seriesId);
    const spec = SPECIMENS[s.specimen]!;
    const geo = geometryFromDimensions(spec.shape.kind, dims(spec));
    const p = fallParameters({
      mass_kg: spec.mass_kg,
      area_m2: geo.area_m2,
      volume_m3: geo.volume_m3,
      drag_coefficient: s.cd,
      density_kg_m3: air.density_kg_m3,
      gravity_m_s2: g,
      added_mass_coefficient: geo.default_added_mass_coefficient,
    });
    actions.push({
      op: 'create',
      kind: 'series',
      id: seriesId,
      body: {
        day_id: dayId,
        specimen_id: specimenIds[s.specimen]!,
        height_m: s.height_m,
        u_height_m: 0.01,
        height_method: 'laser',
        timing_method: s.method,
        u_time_s: s.u_time_s,
        target_relative_uncertainty: 0.05,
        reading_id: null,
        timing_offset: s.extraHeights ? 'fit' : 'none',
        reading_aloft_id: null,
        timing_delay_s: null,
        u_timing_delay_s: null,
        started_at: at(9 + k, 5),
        notes: 'Sample series: invented data.',
      },
    });
    const heights = [s.height_m, ...(s.extraHeights ?? [])];
    let seq = 0;
    for (const h of heights) {
      for (let i = 0; i < s.count; i++) {
        seq++;
        const t = fallTime(h, p) + s.u_time_s * gauss();
        const dropId = store.newId();
        ids.push(dropId);
        actions.push({
          op: 'create',
          kind: 'drop',
          id: dropId,
          body: {
            series_id: seriesId,
            seq,
            raw: { kind: 'typed', text: t.toFixed(3) },
            time_s: Number(t.toFixed(3)),
            height_m: h === s.height_m ? null : h,
            excluded: false,
            exclusion_reason: null,
            note: '',
            captured_at: at(9 + k, 10 + seq),
          },
        });
      }
    }
  });
  await store.commit(actions);
  return ids;
}

/** Removes the sample records (as tombstones, like any removal), days and series with what they hold. */
export async function removeSampleLog(store: LogStore, ids: readonly string[]): Promise<void> {
  const all = await store.allRecords({ includeDeleted: false });
  const wanted = new Set(ids);
  // Days first: a site or specimen can go only once the days and series that use it are gone in the same action.
  const order = { day: 0, specimen: 1, site: 2 } as const;
  const actions: LogAction[] = all
    .filter((r): r is typeof r & { kind: keyof typeof order } => wanted.has(r.id) && r.kind in order)
    .sort((a, b) => order[a.kind] - order[b.kind])
    .map((r) => ({ op: 'remove', kind: r.kind, id: r.id, reason: 'sample log removed' }) as LogAction);
  if (actions.length) await store.commit(actions);
}

import { describe, expect, expectTypeOf, it } from 'vitest';
import { BODY_FIELDS, DROP_COLUMNS, ENUMS, FIELDS, LIMITS, LOG_SCHEMA, RECORD_KINDS, SERIES_COLUMNS, type EveryNumberHasALimit, type FieldSpec, type Limit } from '../../src/log';

type Schema = Record<string, any>;
const defs = LOG_SCHEMA.$defs as unknown as Record<string, Schema>;

/** The schema nodes a body path leads to: one per branch of a tagged union (a shape, a humidity, a capture). */
function nodesAt(schema: Schema, path: string[]): Schema[] {
  if (path.length === 0) return [schema];
  const [head, ...rest] = path;
  const out: Schema[] = [];
  const branches = (s: Schema): Schema[] => [s, ...(s.anyOf ?? []), ...(s.allOf ?? []).map((b: Schema) => b.then)];
  for (const branch of branches(schema)) {
    const next = branch?.properties?.[head!];
    if (next) out.push(...nodesAt(next, rest));
  }
  return out;
}

/** The number ranges a node allows (a nullable number is a number or null). */
function ranges(node: Schema): Schema[] {
  return node.anyOf ? node.anyOf.filter((n: Schema) => n.type === 'number') : [node];
}

const asSchema = (limit: Limit) => ({
  [limit.minIncluded ? 'minimum' : 'exclusiveMinimum']: limit.min,
  maximum: limit.max,
});

const numbers = RECORD_KINDS.flatMap((kind) =>
  Object.entries(FIELDS[kind] as Record<string, FieldSpec>)
    .filter(([, spec]) => spec.type === 'number' || spec.type === 'uncertainty')
    .map(([path, spec]) => [`${kind}.${path}`, kind, path, spec] as const),
);

describe('the field catalogue', () => {
  it('has a limit for every number the record types hold (checked by the compiler; none is left out)', () => {
    expectTypeOf<EveryNumberHasALimit>().toEqualTypeOf<never>();
  });

  it('lists every body field of every kind, and nothing else at the top level', () => {
    for (const kind of RECORD_KINDS) {
      const top = Object.keys(FIELDS[kind]).filter((p) => !p.includes('.'));
      expect(top.sort(), kind).toEqual([...BODY_FIELDS[kind]].sort());
    }
  });

  it.each(numbers)('the published schema allows exactly the range of %s', (_name, kind, path, spec) => {
    const limit = LIMITS[(spec as { limit: keyof typeof LIMITS }).limit];
    const nodes = nodesAt(defs[`${kind}_record`]!, path.split('.'));
    if (`${kind}.${path}` === 'reading.pressure_Pa') {
      // The range depends on pressure_reference: an if/then/else on the record.
      const record = defs['reading_record']!;
      expect(record.if.properties.pressure_reference).toEqual({ const: 'sea_level' });
      expect(record.then.properties.pressure_Pa).toMatchObject(asSchema(LIMITS.sea_level_pressure_Pa));
      expect(record.else.properties.pressure_Pa).toMatchObject(asSchema(LIMITS.station_pressure_Pa));
      return;
    }
    expect(nodes.length, `${kind}.${path} is in the schema`).toBeGreaterThan(0);
    for (const node of nodes) {
      const [range] = ranges(node);
      expect(range).toMatchObject({ type: 'number', ...asSchema(limit) });
      // No other bound than the catalogue's.
      expect(Object.keys(range!).filter((k) => /imum$/.test(k)).sort()).toEqual(Object.keys(asSchema(limit)).sort());
    }
  });

  it('gives the schema the catalogue’s choices for every enumerated field', () => {
    for (const kind of RECORD_KINDS) {
      for (const [path, spec] of Object.entries(FIELDS[kind] as Record<string, FieldSpec>)) {
        if (spec.type !== 'enum') continue;
        const nodes = nodesAt(defs[`${kind}_record`]!, path.split('.'));
        expect(nodes.length, `${kind}.${path}`).toBeGreaterThan(0);
        for (const node of nodes) {
          // The tag of a union is a const in each branch and an enum over all of them.
          if ('const' in node) expect(ENUMS[spec.values]).toContain(node.const);
          else expect(node.enum, `${kind}.${path}`).toEqual([...ENUMS[spec.values]]);
        }
      }
    }
  });

  it('gives each number a unit equal to its limit’s, and the unit is in the field’s name', () => {
    const suffix: Record<string, string> = { m: '_m', kg: '_kg', 'm²': '_m2', 'm³': '_m3', '°C': '_C', Pa: '_Pa', '%': '_pct', 'm/s': '_m_s', s: '_s', Hz: '_Hz', '°': '_deg', px: '_px', '': '' };
    // A clip's evidence keeps the names of the shapes video/ and motion/ share (motion/types.ts: frame_rate_hz).
    const sharedNames = new Set(['drop.clip.frame_rate_hz']);
    for (const [name, , path, spec] of numbers) {
      const s = spec as { limit: keyof typeof LIMITS; unit: string };
      expect(s.unit, name).toBe(LIMITS[s.limit].unit);
      const named = sharedNames.has(name) ? path.toLowerCase().endsWith(suffix[s.unit]!.toLowerCase()) : path.endsWith(suffix[s.unit]!);
      expect(named, `${name} ends in ${suffix[s.unit]}`).toBe(true);
    }
  });
});

describe('the CSV tables', () => {
  // Columns that are not a stored field of one record: ids and names joined in, counts, and computed results.
  const JOINED_OR_COMPUTED = new Set([
    'day_date',
    'site_name',
    'series_id',
    'series_started_at',
    'specimen_id',
    'specimen_name',
    'drop_id',
    'shape',
    'drops_total',
    'drops_used',
    'air_density_kg_m3',
    'gravity_m_s2',
    'drag_coefficient',
    'u_drag_coefficient',
    'U_drag_coefficient_k2',
    'drag_coefficient_95_low',
    'drag_coefficient_95_high',
    'predicted_time_s',
    'u_predicted_time_s',
    'residual_s',
    'vacuum_time_s',
    'impact_speed_m_s',
    'impact_energy_J',
    'reynolds_number',
    // The reading's height_m, named apart from the series' release height in the same row.
    'reading_height_m',
    'timing_offset_s',
    'terminal_velocity_m_s',
    'warnings',
    'error_code',
    'error_message',
    // Drops with marks and clips: a count, a fitted value, and the clip's summary named clip_… in the drops table.
    'mark_count',
    'release_shift_s',
    'clip_codec',
    'clip_frame_rate_hz',
    'clip_release_s',
    'u_clip_release_s',
    'clip_impact_s',
    'u_clip_impact_s',
  ]);
  const stored = new Set(RECORD_KINDS.flatMap((kind) => Object.keys(FIELDS[kind]).map((p) => p.split('.').pop()!)));

  it('name every stored column exactly as the catalogue names the field', () => {
    for (const column of [...DROP_COLUMNS, ...SERIES_COLUMNS]) {
      if (JOINED_OR_COMPUTED.has(column)) continue;
      expect(stored.has(column), column).toBe(true);
    }
  });
});

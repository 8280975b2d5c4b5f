/**
 * The checks made before a record is written: every record it points at exists and is live (stored, or
 * staged earlier in the same action), and a series' air reading belongs to the series' own day.
 */
import type { LogRecord, RecordKind } from '../log';
import { StoreError } from './errors';
import { isLive } from './live-records';
import type { Staging } from './staging';

interface Reference {
  field: string;
  kind: RecordKind;
  /** The id pointed at; null where the field may be empty (a series without a reading). */
  id: string | null;
}

/** Which record field points at which kind. */
function referencesOf(record: LogRecord): Reference[] {
  switch (record.kind) {
    case 'site':
    case 'specimen':
      return [];
    case 'day':
      return [{ field: 'site_id', kind: 'site', id: record.site_id }];
    case 'reading':
      return [{ field: 'day_id', kind: 'day', id: record.day_id }];
    case 'series':
      return [
        { field: 'day_id', kind: 'day', id: record.day_id },
        { field: 'specimen_id', kind: 'specimen', id: record.specimen_id },
        { field: 'reading_id', kind: 'reading', id: record.reading_id },
        { field: 'reading_aloft_id', kind: 'reading', id: record.reading_aloft_id },
      ];
    case 'drop':
      return [{ field: 'series_id', kind: 'series', id: record.series_id }];
  }
}

/**
 * Refuses `record` when a reference it sets is missing or deleted. A reference unchanged from `previous`
 * is not checked again: a revision of a drop whose series was removed elsewhere can still be written.
 */
export async function checkReferences(record: LogRecord, previous: LogRecord | undefined, staging: Staging): Promise<void> {
  const before = new Map(previous ? referencesOf(previous).map((r) => [r.field, r.id]) : []);
  const checks = referencesOf(record).filter((ref): ref is Reference & { id: string } => ref.id !== null && before.get(ref.field) !== ref.id);
  const found = await Promise.all(checks.map(({ kind, id }) => staging.lookup(kind, id)));
  checks.forEach((ref, i) => {
    const target = found[i];
    if (!isLive(target)) {
      throw new StoreError({
        code: 'reference-missing',
        field: `${record.kind}.${ref.field}`,
        value: ref.id,
        allowed: `the id of a saved, live ${ref.kind}`,
        message: `${record.kind}.${ref.field}: no ${ref.kind} ${ref.id}${target ? ' (it is deleted)' : ''}; allowed: the id of a saved, live ${ref.kind}: save it first or in the same action`,
      });
    }
    if (record.kind === 'series' && target.kind === 'reading' && target.day_id !== record.day_id) {
      throw new StoreError({ code: 'reference-missing', field: `series.${ref.field}`, value: ref.id, allowed: 'a reading of the same day', message: `series.${ref.field}: reading ${ref.id} belongs to another day` });
    }
  });
}

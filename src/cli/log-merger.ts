/**
 * Logs merged one file after another exactly as the phone imports them (sync/import-log.ts: previewGatedMerge,
 * then the changes written, the conflicts added to the list), into a log that starts empty: the office is one
 * more reader of the folder. Nothing is lost: a record's versions are the union of every file's (log/merge.ts),
 * and each concurrent pair is listed.
 *
 * previewGatedMerge is handed only the part of the log the file can touch, which gives the same result as the
 * whole log at a cost that follows the file, not the season: the merge looks up the file's own ids, and the
 * gate the ids the file's records and their merged copies link to (log/record-gate.ts gateLookups).
 */
import { addConflicts, gateLookups, previewGatedMerge, sortRecords, type Conflict, type LogFile, type LogRecord, type MergePreview } from '../log';

export class LogMerger {
  private readonly records = new Map<string, LogRecord>();
  private found: Conflict[] = [];

  /** Merges one checked file; throws LogFileError (naming the file, record, field and value) as an import would. */
  add(file: LogFile, name?: string): MergePreview {
    const touched = new Map<string, LogRecord>();
    const take = (ids: Iterable<string>) => {
      for (const id of ids) {
        const held = this.records.get(id);
        if (held && !touched.has(id)) touched.set(id, held);
      }
    };
    take(gateLookups(file.records));
    take(gateLookups([...touched.values()]));
    const preview = previewGatedMerge(file, [...touched.values()], name);
    for (const record of preview.changes) this.records.set(record.id, record);
    this.found.push(...preview.conflicts);
    return preview;
  }

  /** The merged log, in export order (parents first, then by id). */
  merged(): LogRecord[] {
    return sortRecords([...this.records.values()]);
  }

  /** Every conflict found, each (record, losing version) once, as the phone's list keeps them. */
  conflicts(): Conflict[] {
    return addConflicts([], this.found);
  }
}

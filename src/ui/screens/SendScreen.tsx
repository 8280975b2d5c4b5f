import type { ComponentChildren } from 'preact';
import { useEffect, useRef, useState } from 'preact/hooks';
import { decodeLogBytes, logFileName, recordsFromClockAhead, TransferCancelled, type Conflict, type LogRecord, type LogSelection, type MergePreview } from '../../log';
import {
  applyPreviewedImport,
  dismissConflict,
  loadConflicts,
  loadSkippedFiles,
  loadSyncSettings,
  logCsvFilesInSteps,
  previewImport,
  saveSyncSettings,
  sendLog,
  type ImportPreview,
  type SkippedFile,
  type SyncReport,
} from '../../sync';
import { pickFile, shareFile, shareFiles, type ShareOutcome } from '../../sync/page';
import { useApp } from '../app-context';
import { useStoreData } from '../hooks';
import { Notice, SelectField, TextField } from '../forms';
import { RiskWarnings } from '../RiskWarnings';
import { currentSyncService, type SyncService } from '../sync-service';
import { describeError } from '../errors';
import { localDate } from '../dates';
import { exportNaming, incomingDays, incomingSites, tablesFileStem } from '../send-names';
import { SYNC_CANCELLED_TEXT, SYNC_CANCELLING_TEXT } from '../progress-text';
import { TransferBar } from '../TransferBar';
import { useTransfer, type Transfer } from '../use-transfer';

/** A message as a sentence: it ends with a full stop before the next one starts. */
function sentence(text: string): string {
  return /[.!?]$/.test(text.trim()) ? text.trim() : `${text.trim()}.`;
}

/** What happened to a file, in the crew's words: on this phone, handed to another app, or nothing. */
export function outcomeText(outcome: ShareOutcome, what: string): { tone: 'good' | 'info'; text: string } {
  if (outcome === 'shared') return { tone: 'good', text: `Shared: ${what} went to the app you picked. It is in the office once that app has sent it.` };
  if (outcome === 'downloaded')
    return {
      tone: 'info',
      text: `Saved as a file on this phone (${what}, in Downloads). It is not sent yet: mail it, copy it off the phone, or use the office folder below.`,
    };
  return { tone: 'info', text: 'Sharing was cancelled: nothing left the phone.' };
}

/** Getting the log to the office: files (share or download), importing a file, and the office folder. */
export function SendScreen() {
  const sync = currentSyncService();
  const app = useApp();
  const [message, setMessage] = useState<{ tone: 'good' | 'bad' | 'info'; text: string } | null>(null);
  const [incoming, setIncoming] = useState<ImportPreview | null>(null);
  const [incomingLocal, setIncomingLocal] = useState<readonly LogRecord[]>([]);
  const [part, setPart] = useState('all');
  const [busy, setBusy] = useState(false);
  const transfer = useTransfer();
  // Where the bar of the transfer running is drawn: beside the buttons that started it.
  const [barAt, setBarAt] = useState<'files' | 'folder'>('files');
  const days = useStoreData(() => app.store.listDays(), []);
  const messageBox = useRef<HTMLDivElement>(null);
  // A message appears under the buttons that caused it and is brought into view (the box is a live region too).
  useEffect(() => {
    if (message) messageBox.current?.scrollIntoView?.({ block: 'nearest' });
  }, [message]);
  const naming = () => exportNaming(part, days.state === 'ready' ? days.value : [], localDate());

  const exportJson = async () => {
    setMessage(null);
    setBarAt('files');
    setBusy(true);
    try {
      const selection: Partial<LogSelection> | null =
        part === 'all' ? null : part === 'catalogue' ? { kinds: ['specimen', 'site'] } : { day_ids: [part] };
      const { date, label } = naming();
      let name = '';
      const outcome = await transfer.run('Writing the log file', (options) =>
        sendLog(app.store, { appVersion: __APP_VERSION__, selection, now: () => new Date(), transfer: options }, async (log) => {
          name = logFileName(log.device, date, label);
          const shared = await shareFile({ name, text: log.text, type: 'application/json' }, undefined, 'Plummet log');
          // Only the whole log handed to another app counts as sent: a download stays on this phone, and a part
          // leaves the rest of the changes unsent.
          return { sent: shared === 'shared' && part === 'all', value: shared };
        }),
      );
      if (outcome === 'shared' && part === 'all') await app.refreshStatus();
      if (outcome !== 'cancelled') await app.updateSettings({ lastHandoff: { how: outcome === 'shared' ? 'shared' : 'saved', at: new Date().toISOString() } });
      setMessage(outcomeText(outcome, name));
    } catch (e) {
      setMessage(e instanceof TransferCancelled ? { tone: 'info', text: 'Cancelled: no file was written and nothing left the phone.' } : { tone: 'bad', text: describeError(e) });
    } finally {
      setBusy(false);
    }
  };

  const exportCsv = async () => {
    setMessage(null);
    setBarAt('files');
    setBusy(true);
    try {
      const { date, label } = exportNaming('all', days.state === 'ready' ? days.value : [], localDate());
      // Each series is computed in turn (its analysis and Monte Carlo): long for a season, so it shows the bar
      // and stops on Cancel before anything is shared.
      const files = await transfer.run(
        'Making the tables (CSV)',
        async (options) => {
          options.onProgress({ phase: 'reading', done: 0, total: 0 });
          const records = await app.store.allRecords({ includeDeleted: false });
          return logCsvFilesInSteps(records, tablesFileStem(date, label), options);
        },
        { cancelling: 'Cancelling… no tables will be made' },
      );
      // Both tables in one share: a phone allows one share sheet per tap, so a second call would fail.
      const outcome = await shareFiles(files, undefined, 'Plummet tables');
      const what = files.length > 2 ? 'three CSV files, one row per drop, per series and per mark' : 'two CSV files, one row per drop and one row per series';
      setMessage(outcomeText(outcome, `${what}: ${files.map((f) => f.name).join(', ')}`));
    } catch (e) {
      setMessage(e instanceof TransferCancelled ? { tone: 'info', text: 'Cancelled: no tables were made and nothing left the phone.' } : { tone: 'bad', text: describeError(e) });
    } finally {
      setBusy(false);
    }
  };

  const chooseImport = async () => {
    setMessage(null);
    setIncoming(null);
    setBarAt('files');
    try {
      const file = await pickFile();
      if (!file) return;
      // The same decoding as the office command: UTF-8 with or without its mark, UTF-16 with one; malformed bytes
      // refused by offset (file.text() would put U+FFFD in their place). The browser's strict decoder does the work.
      const strictUtf8 = (bytes: Uint8Array) => new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
      const preview = await transfer.run(`Reading ${file.name}`, async (options) =>
        previewImport(app.store, decodeLogBytes(new Uint8Array(await file.arrayBuffer()), strictUtf8), file.name, options),
      );
      setIncomingLocal(await app.store.allRecords({ includeDeleted: true }));
      setIncoming(preview);
    } catch (e) {
      if (e instanceof TransferCancelled) setMessage({ tone: 'info', text: 'Cancelled: the file was not imported and nothing was changed.' });
      else setMessage({ tone: 'bad', text: `This file cannot be imported: ${sentence(describeError(e))} Nothing was changed.` });
    }
  };

  const confirmImport = async () => {
    if (!incoming) return;
    try {
      const done: MergePreview = await transfer.run('Merging into this log', (options) => applyPreviewedImport(app.store, incoming, options));
      setIncoming(null);
      app.notifyChanged();
      setMessage({ tone: 'good', text: `Imported: ${done.added.length} added, ${done.updated.length} updated, ${done.conflicts.length} conflicts kept for review.` });
    } catch (e) {
      if (e instanceof TransferCancelled) setMessage({ tone: 'info', text: 'Cancelled: nothing was merged, this log is as it was.' });
      else setMessage({ tone: 'bad', text: `The import failed and nothing was written: ${sentence(describeError(e))}` });
    }
  };

  return (
    <div>
      <SentState />
      <section class="card" aria-labelledby="files-h">
        <h2 id="files-h">By file</h2>
        <SelectField
          id="send-part"
          label="What to send"
          value={part}
          options={[
            { value: 'all', label: 'The whole log' },
            { value: 'catalogue', label: 'Specimens and sites only (a catalogue)' },
            ...(days.state === 'ready' ? days.value.map((d) => ({ value: d.id, label: `The day ${d.date} at ${d.site_name ?? 'an unknown site'}` })) : []),
          ]}
          onChange={setPart}
        />
        <div class="btn-col">
          <button type="button" class="btn" onClick={exportJson} disabled={busy || transfer.running}>
            Send as a log file (JSON)
          </button>
          <button type="button" class="btn btn-quiet" onClick={exportCsv} disabled={busy || transfer.running}>
            Tables for a spreadsheet (CSV)
          </button>
          <button type="button" class="btn btn-quiet" onClick={chooseImport} disabled={transfer.running}>
            Import a log file
          </button>
        </div>
        {transfer.view && !incoming && barAt === 'files' ? <TransferBar view={transfer.view} /> : null}
        <div ref={messageBox} class="message-slot" role="status" aria-live="polite" data-testid="send-message">
          {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
        </div>
        {incoming ? (
          <IncomingPreview incoming={incoming} local={incomingLocal} busy={transfer.running} onMerge={confirmImport} onCancel={() => setIncoming(null)}>
            {/* Beside the Merge button the crew just tapped, where they are looking. */}
            {transfer.view ? <TransferBar view={transfer.view} /> : null}
          </IncomingPreview>
        ) : null}
      </section>
      <Conflicts />
      <ClockAhead />
      <FolderSync sync={sync} transfer={transfer} showBar={barAt === 'folder'} onStart={() => setBarAt('folder')} />
    </div>
  );
}

/** Whether anything waits to leave the phone, and how the log last left it. */
function SentState() {
  const app = useApp();
  const status = app.status;
  const handoff = app.settings.lastHandoff;
  const sync = currentSyncService();
  const folderAt = sync?.lastReport?.ok && sync.lastReport.uploaded ? sync.lastReport.finished_at : null;
  const last = folderAt && (!handoff || folderAt > handoff.at) ? { how: 'folder' as const, at: folderAt } : handoff;
  const when = (iso: string) => new Date(iso).toLocaleString();
  const unsent = status?.unsentChanges ?? 0;
  let heading: string;
  if (unsent > 0) heading = `${unsent} change${unsent === 1 ? '' : 's'} not yet shared or in the office folder`;
  else if (last?.how === 'folder' || (!last && status?.lastSentAt)) heading = 'Everything is in the office folder';
  else if (last?.how === 'shared') heading = 'Everything is shared';
  else heading = 'Nothing to send yet';
  return (
    <section class="card" aria-labelledby="unsent-h">
      <h2 id="unsent-h">{heading}</h2>
      {last ? (
        <p class="hint">
          {last.how === 'saved' ? 'Last saved as a file on this phone' : last.how === 'shared' ? 'Last shared' : 'Last in the office folder'}: {when(last.at)}.
          {last.how === 'saved' && unsent > 0 ? ' A saved file is still on this phone: it protects nothing if the phone is lost.' : ''}
        </p>
      ) : (
        <p class="hint">Last export or sync: {status?.lastSentAt ? when(status.lastSentAt) : 'never'}.</p>
      )}
      <RiskWarnings compact />
    </section>
  );
}

/** What an incoming file holds, named as the crew knows it: its phone, its days by date and site, its sites. */
function IncomingPreview({
  incoming,
  local,
  busy,
  onMerge,
  onCancel,
  children,
}: {
  incoming: ImportPreview;
  local: readonly LogRecord[];
  busy: boolean;
  onMerge(): void;
  onCancel(): void;
  children?: ComponentChildren;
}) {
  const days = incomingDays(incoming.file.records, local);
  const sites = incomingSites(incoming.file.records);
  return (
    <div class="subform" role="group" aria-label="Import preview">
      <p>
        From device <span class="mono">{incoming.file.device}</span>: <strong>{incoming.preview.added.length}</strong> records to add,{' '}
        <strong>{incoming.preview.updated.length}</strong> to update, {incoming.preview.unchanged} unchanged,{' '}
        <strong>{incoming.preview.conflicts.length}</strong> in conflict (kept for review, nothing dropped).
      </p>
      {days.length ? (
        <>
          <p class="hint">Test days in the file:</p>
          <ul class="plain-list" aria-label="Test days in the file">
            {days.map((d) => (
              <li key={d.id}>
                {d.date} at {d.site}
                {d.isNew ? ' (new on this phone)' : ' (already here)'}
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p class="hint">The file holds no test day.</p>
      )}
      {sites.length ? <p class="hint">Sites: {sites.join(', ')}.</p> : null}
      <div class="btn-row">
        <button type="button" class="btn" onClick={onMerge} disabled={busy}>
          Merge into this log
        </button>
        <button type="button" class="btn btn-quiet" onClick={onCancel} disabled={busy}>
          Cancel
        </button>
      </div>
      {children}
    </div>
  );
}

function FolderSync({ sync, transfer, showBar, onStart }: { sync: SyncService | null; transfer: Transfer; showBar: boolean; onStart(): void }) {
  const app = useApp();
  const source = app.store;
  const saved = useStoreData(() => loadSyncSettings(source).catch(() => null), []);
  const [url, setUrl] = useState('');
  const [user, setUser] = useState('');
  const [password, setPassword] = useState('');
  const [enabled, setEnabled] = useState(true);
  const [error, setError] = useState<string | null>(null);
  const [report, setReport] = useState<SyncReport | null>(shown(sync?.lastReport ?? null));
  const [busy, setBusy] = useState(false);
  const [stopped, setStopped] = useState(false);
  useEffect(() => {
    if (saved.state === 'ready' && saved.value) {
      setUrl(saved.value.folder_url);
      setUser(saved.value.username);
      setPassword(saved.value.password);
      setEnabled(saved.value.enabled);
    }
  }, [saved.state]);
  useEffect(() => sync?.subscribe((r) => setReport(shown(r))), [sync]);

  const save = async () => {
    setError(null);
    try {
      await saveSyncSettings(source, { folder_url: url.trim(), username: user, password, enabled });
      setError(null);
      void sync?.syncNow('change').catch(() => undefined);
      app.notifyChanged();
    } catch (e) {
      setError(describeError(e));
    }
  };
  const syncNow = async () => {
    if (!sync) return;
    setBusy(true);
    setStopped(false);
    setError(null);
    onStart();
    try {
      setReport(shown(await transfer.run('Syncing with the office folder', (options) => sync.syncNow('manual', options), { cancelling: SYNC_CANCELLING_TEXT })));
    } catch (e) {
      if (e instanceof TransferCancelled) {
        setStopped(true);
        // What was merged before the Cancel is in the log: the screens read it again.
        app.notifyChanged();
      } else setError(describeError(e));
    } finally {
      setBusy(false);
      await app.refreshStatus();
    }
  };

  return (
    <section class="card" aria-labelledby="folder-h">
      <h2 id="folder-h">Office folder (WebDAV)</h2>
      <p class="hint">Each phone writes its own file in the folder and merges the others’. The password stays on this phone and never goes into an export.</p>
      <TextField id="dav-url" label="Folder URL" hint="https://… (http only for this computer)" value={url} onInput={setUrl} autocomplete="url" />
      <TextField id="dav-user" label="User name" value={user} onInput={setUser} autocomplete="username" />
      <div class="field">
        <label for="dav-pass">Password</label>
        <input id="dav-pass" type="password" value={password} autocomplete="current-password" onInput={(e) => setPassword((e.target as HTMLInputElement).value)} />
      </div>
      <label class="check">
        <input type="checkbox" checked={enabled} onChange={(e) => setEnabled((e.target as HTMLInputElement).checked)} />
        <span>Sync by itself when the phone is online</span>
      </label>
      {error ? <Notice tone="bad">{error}</Notice> : null}
      <div class="btn-row">
        <button type="button" class="btn btn-quiet" onClick={save}>
          Save folder
        </button>
        <button type="button" class="btn" onClick={syncNow} disabled={busy || !sync || transfer.running}>
          {busy ? 'Syncing…' : 'Sync now'}
        </button>
      </div>
      {transfer.view && showBar ? <TransferBar view={transfer.view} /> : null}
      {stopped ? (
        <div role="status" data-testid="sync-cancelled">
          <Notice tone="info">{SYNC_CANCELLED_TEXT}</Notice>
        </div>
      ) : null}
      {report ? (
        <div role="status">
          <Notice tone={report.ok ? 'good' : 'bad'} title={report.ok ? 'Last sync succeeded' : 'Last sync failed'}>
            <p>
              {new Date(report.finished_at).toLocaleString()}: {report.merged.length} files merged, {report.skipped} unchanged
              {report.problems.length ? `, ${report.problems.length} skipped (listed below)` : ''}
              {report.uploaded ? ', this phone’s file is in the office folder' : ''}.
            </p>
            {report.error ? <p>{report.error.message}</p> : null}
            {report.conflicts.length ? <p>{report.conflicts.length} conflicts kept for review.</p> : null}
          </Notice>
        </div>
      ) : null}
      <SkippedFiles finishedAt={report?.finished_at ?? null} />
    </section>
  );
}

/**
 * Files of the folder that sync could not merge and skips (each until it changes), as the sync state keeps them:
 * which file, from which phone, which record and field, and why. The rest of the folder was merged and this
 * phone's own file sent all the same.
 */
function SkippedFiles({ finishedAt }: { finishedAt: string | null }) {
  const app = useApp();
  const list = useStoreData(() => loadSkippedFiles(app.store).catch((): SkippedFile[] => []), [finishedAt]);
  if (list.state !== 'ready' || list.value.length === 0) return null;
  return (
    <div class="subform" role="group" aria-labelledby="skipped-h">
      <h3 id="skipped-h">Files skipped ({list.value.length})</h3>
      <p class="hint">
        These files in the folder could not be merged and were left as they are; everything else was synced. Ask whoever wrote a file to send it again,
        or remove it from the folder. A file is read again once it changes.
      </p>
      <ul class="rows" aria-label="Files skipped">
        {list.value.map((f) => (
          <li key={f.name} class="row">
            <span class="row-main">
              <strong class="mono">{f.name}</strong>
              {f.device ? <> · from phone <span class="mono">{f.device}</span></> : null}
              <br />
              <span class="hint">
                {f.record ? <>record <span class="mono">{f.record}</span>{f.field ? ', ' : ' · '}</> : null}
                {f.field ? <>field <span class="mono">{f.field}</span> · </> : null}
                {f.message}
              </span>
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Two phones changed the same record: the newer version is current, the other is kept in its history. */
function Conflicts() {
  const app = useApp();
  const source = app.store;
  const list = useStoreData(() => loadConflicts(source), []);
  if (list.state !== 'ready' || list.value.length === 0) return null;
  return (
    <section class="card" aria-labelledby="conflicts-h">
      <h2 id="conflicts-h">Conflicts to look at ({list.value.length})</h2>
      <p class="hint">
        Two phones changed the same record, or a file brought a different version under the same stamp. One version is in use; the other is kept in
        the record’s history, nothing was dropped. Check the values, correct the record if needed, and say why the record is right as it is.
      </p>
      <ul class="rows">
        {list.value.map((c) => (
          <ConflictRow key={`${c.id}-${c.other_rev}-${c.other_version ?? ''}`} conflict={c} />
        ))}
      </ul>
    </section>
  );
}

function ConflictRow({ conflict: c }: { conflict: Conflict }) {
  const app = useApp();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const id = `settle-${c.id}-${c.other_version ?? c.other_rev}`;
  const settle = async () => {
    try {
      await dismissConflict(app.store, c.id, c.other_rev, reason, new Date(), c.other_version);
      app.notifyChanged();
    } catch (e) {
      setError(describeError(e));
    }
  };
  return (
    <li class="row">
      <div class="row-main">
        <strong>
          {c.kind} {c.id.slice(0, 8)}
        </strong>
        {c.measured ? ' · a measured value differs' : ''}
        {c.same_stamp ? ' · two versions under the same stamp (a file changed by hand?)' : ''}
        <br />
        <span class="hint">
          fields: {c.fields.join(', ')} ·{' '}
          {c.same_stamp
            ? `this phone held the version from ${c.kept_device}; the other one came in from a file, both are kept`
            : `kept the change from ${c.kept_device}, the one from ${c.other_device} is in the history`}
        </span>
        <TextField id={id} label="Why the record is right as it is" value={reason} onInput={setReason} />
        {error ? <Notice tone="bad">{error}</Notice> : null}
      </div>
      <button type="button" class="btn btn-small btn-quiet" disabled={reason.trim() === ''} onClick={settle}>
        Checked
      </button>
    </li>
  );
}

/** Records whose stamp is far ahead of this phone's time: kept, but from a phone whose clock is wrong. */
function ClockAhead() {
  const app = useApp();
  const list = useStoreData(async () => recordsFromClockAhead(await app.store.allRecords({ includeDeleted: true }), Date.now()), []);
  if (list.state !== 'ready' || list.value.length === 0) return null;
  const shown = list.value.slice(0, 10);
  return (
    <section class="card" aria-labelledby="ahead-h">
      <h2 id="ahead-h">From a clock far ahead ({list.value.length})</h2>
      <p class="hint">
        These records carry a time stamp more than an hour ahead of this phone’s clock: the phone that wrote them had a wrong date. They are kept
        and sent like any other record and did not move this phone’s clock, but their version wins over changes made elsewhere before it was seen.
      </p>
      <ul class="rows">
        {shown.map((r) => (
          <li key={r.id} class="row">
            <span class="row-main">
              <strong>
                {r.kind} {r.id.slice(0, 8)}
              </strong>{' '}
              from <span class="mono">{r.device}</span> · stamped {new Date(Number(r.rev.slice(0, 15))).toISOString().slice(0, 10)}
            </span>
          </li>
        ))}
      </ul>
      {list.value.length > shown.length ? <p class="hint">and {list.value.length - shown.length} more.</p> : null}
    </section>
  );
}

/** Runs that only found no folder set up, or automatic sync switched off, are not news for the crew. */
function shown(report: SyncReport | null): SyncReport | null {
  return report && (report.error?.code === 'sync-not-configured' || report.error?.code === 'sync-disabled') ? null : report;
}

// Entering a drop as marks along the fall. A series timed by gates: one time field per gate (the distances were
// typed once with the series), Enter moves to the next gate and the last adds the drop. Any other series: a list of
// distance/time pairs, rows added and removed. The drop's own time and height are its last mark (analysis/marks-drop.ts).
import { useRef, useState } from 'preact/hooks';
import { inputRange, LIMITS, LIST_LIMITS, type DropMark, type SeriesRecord } from '../../../../log';
import { dropOfMarks, markCountAllowed, typedMarkProblems, type TypedMarkProblem } from '../../../../analysis';
import { useApp } from '../../../app-context';
import { Notice, QField, field, fieldsValid, type FieldState } from '../../../forms';
import { describeError } from '../../../errors';
import { useUndo } from '../../../undo';

interface Row {
  distance: FieldState;
  time: FieldState;
}

const emptyRow = (distance: number | null = null): Row => ({ distance: field(distance), time: field() });

export function MarksEntry({ series, nextSeq }: { series: SeriesRecord; nextSeq: number }) {
  const app = useApp();
  const { offerUndo } = useUndo();
  const gates = series.gate_distances_m;
  const initial = () => (gates ? gates.map((g) => emptyRow(g)) : [emptyRow(), emptyRow()]);
  const [rows, setRows] = useState<Row[]>(initial);
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const box = useRef<HTMLDivElement>(null);
  const noun = gates ? 'Gate' : 'Mark';

  const focusTime = (i: number) => (box.current?.querySelectorAll('[data-mark-time] pl-quantity')[i] as { focus?: () => void } | undefined)?.focus?.();
  const setRow = (i: number, change: Partial<Row>) => {
    setRows((all) => all.map((r, k) => (k === i ? { ...r, ...change } : r)));
    if (error) setError(null);
  };

  /** A problem in words, in the crew's units, naming the gate or mark, the value and the range. */
  const wording = (p: TypedMarkProblem): string => {
    const kind = p.field === 'distance_m' ? 'length' : 'time';
    const what = `${noun} ${p.index + 1} ${p.field === 'distance_m' ? 'distance' : 'time'} ${app.format(p.value, kind)}`;
    if (p.rule === 'order') return `${what} must be more than ${noun.toLowerCase()} ${p.index}'s (${app.format(p.bound, kind)}): marks rise along the fall.`;
    if (p.rule === 'height') return `${what} is beyond the release height (${app.format(p.bound, 'length')}).`;
    const limit = p.field === 'distance_m' ? LIMITS.mark_distance_m : LIMITS.mark_time_s;
    return `${what} is out of range: ${app.format(limit.min, kind)} to ${app.format(limit.max, kind)}.`;
  };

  const save = async (current: Row[] = rows) => {
    if (saving) return;
    const missing = current.findIndex((r) => !fieldsValid(r.distance, r.time));
    if (missing >= 0) {
      setError(`${noun} ${missing + 1} needs its ${fieldsValid(current[missing]!.distance) ? 'time' : 'distance'}.`);
      return;
    }
    const marks: DropMark[] = current.map((r) => ({ distance_m: r.distance.value!, time_s: r.time.value! }));
    if (!markCountAllowed(marks.length)) {
      setError(`A drop takes ${LIST_LIMITS.marks_min} to ${LIST_LIMITS.marks_max} marks; this one has ${marks.length}.`);
      return;
    }
    const problems = typedMarkProblems(marks, series.height_m);
    if (problems.length > 0) {
      setError(problems.map(wording).join(' '));
      return;
    }
    setSaving(true);
    setError(null);
    try {
      const own = dropOfMarks(marks, series.height_m);
      const drop = await app.store.create('drop', {
        series_id: series.id,
        seq: nextSeq,
        raw: { kind: 'typed', text: current.map((r) => r.time.text ?? String(r.time.value)).join(' ').slice(0, 100) },
        ...own,
        release_time_known: true,
        excluded: false,
        exclusion_reason: null,
        note: '',
        captured_at: new Date().toISOString(),
      });
      setRows(gates ? gates.map((g) => emptyRow(g)) : current.map((r) => ({ distance: r.distance, time: field() })));
      offerUndo(`Drop ${drop.seq} added: ${marks.length} marks`, [drop]);
      app.notifyChanged();
      setSaved(`Drop ${drop.seq} saved: ${marks.length} marks, the last at ${app.format(own.time_s, 'time')}`);
      focusTime(0);
    } catch (e) {
      setError(describeError(e));
    } finally {
      setSaving(false);
    }
  };

  return (
    <div class="marks-entry" ref={box} data-testid="marks-entry">
      {rows.map((row, i) => (
        <div class="two" key={i} data-mark-row={i}>
          {gates ? (
            <p class="mark-gate">
              {noun} {i + 1}: {app.format(gates[i]!, 'length')}
            </p>
          ) : (
            <QField label={`${noun} ${i + 1} distance fallen`} kind="length" compact state={row.distance} {...inputRange(LIMITS.mark_distance_m)} onChange={(distance) => setRow(i, { distance })} />
          )}
          <div data-mark-time>
            <QField
              label={`${noun} ${i + 1} time`}
              kind="time"
              compact
              state={row.time}
              {...inputRange(LIMITS.mark_time_s)}
              enterHint={i === rows.length - 1 ? 'done' : 'next'}
              onChange={(time) => setRow(i, { time })}
              onEnter={(time) => {
                const next = rows.map((r, k) => (k === i ? { ...r, time } : r));
                setRows(next);
                if (i < rows.length - 1) focusTime(i + 1);
                else void save(next);
              }}
            />
          </div>
        </div>
      ))}
      {gates ? null : (
        <div class="btn-row">
          <button type="button" class="btn btn-quiet btn-small" disabled={rows.length >= LIST_LIMITS.marks_max} onClick={() => setRows([...rows, emptyRow()])}>
            Add a mark
          </button>
          <button type="button" class="btn btn-quiet btn-small" disabled={rows.length <= LIST_LIMITS.marks_min} onClick={() => setRows(rows.slice(0, -1))}>
            Remove the last mark
          </button>
        </div>
      )}
      <div class="entry-bar">
        {error ? <Notice tone="bad">{error}</Notice> : null}
        <button type="button" class="btn btn-block btn-big" disabled={saving} onClick={() => void save()}>
          Add drop {nextSeq}
        </button>
        <p class="entry-saved" role="status" aria-live="polite" data-testid="drop-saved">
          {saved ? `✓ ${saved}` : ''}
        </p>
      </div>
    </div>
  );
}

// Timing a drop from a clip, on the phone and offline: pick (or film) a clip; on a still frame tap the fall line
// and the landing line, and optionally two or three marks of known height; read every frame (a worker decodes
// them; a progress bar, cancel); then a strip of frames around the found release and impact, where the crew can
// step frame by frame and move either instant by hand (with a reason, kept in the drop's history); then make the
// drop. Nothing is stored until "Make the drop"; every refusal shows its message and leaves the log as it was.
import { useEffect, useRef, useState } from 'preact/hooks';
import { clipBand, findFall, moveInstant, type ClipProbe, type ClipSetup, type FallFinding, type GreyClip, type TrackPoint } from '../../../../motion';
import type { ClipReader, BandProgress } from '../../../../video';
import { inputRange, LIMITS, type SeriesRecord } from '../../../../log';
import { useApp } from '../../../app-context';
import { Notice, QField, TextField, field, fieldsValid, type FieldState } from '../../../forms';
import { describeError } from '../../../errors';
import { useUndo } from '../../../undo';
import { clipDropFields, fallTimeUncertainty } from './video-drop';
import { keyFrameImage, paintGrey, stripWindow, type StripWindow } from './frame-strip';

type Finding = FallFinding;

type Stage =
  | { kind: 'pick' }
  | { kind: 'opening' }
  | { kind: 'setup' }
  | { kind: 'running'; progress: BandProgress | null }
  | { kind: 'found'; clip: GreyClip; setup: ClipSetup; finding: Finding };

/** The taps on the still frame, in order; the scale marks come after. */
const TAP_STEPS = [
  'Tap the top of the fall line, just above the release point.',
  'Tap the bottom of the fall line, at the landing point.',
  'Tap the landing line: where the body meets the ground.',
] as const;

/** Frames shown each side of a found instant in the strip. */
const STRIP_SIDE = 3;

interface Point {
  x: number;
  y: number;
}

export function VideoEntry({ series, nextSeq, releaseHeight }: { series: SeriesRecord; nextSeq: number; releaseHeight: number }) {
  const app = useApp();
  const { offerUndo } = useUndo();
  const [stage, setStage] = useState<Stage>({ kind: 'pick' });
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const reader = useRef<ClipReader | null>(null);
  const still = useRef<ImageBitmap | null>(null);
  const running = useRef<AbortController | null>(null);
  const [taps, setTaps] = useState<Point[]>([]);
  const [scale, setScale] = useState<{ at: Point; height: FieldState }[]>([]);
  const [addingMark, setAddingMark] = useState(false);
  const canvas = useRef<HTMLCanvasElement>(null);

  useEffect(
    () => () => {
      running.current?.abort();
      reader.current?.close();
    },
    [],
  );

  const reset = () => {
    running.current?.abort();
    reader.current?.close();
    reader.current = null;
    still.current = null;
    setTaps([]);
    setScale([]);
    setAddingMark(false);
    setStage({ kind: 'pick' });
  };

  const pick = async (file: File | undefined) => {
    if (!file) return;
    reset();
    setError(null);
    setSaved(null);
    setStage({ kind: 'opening' });
    try {
      const { openClip } = await import('../../../../video');
      const r = await openClip(file);
      reader.current = r;
      // A frame a little into the clip: the body hangs at its release point, the crew sees the whole scene.
      still.current = await r.still(Math.min(0.2, r.probe.duration_s / 2), Math.min(1280, r.probe.width_px));
      setStage({ kind: 'setup' });
    } catch (e) {
      reader.current?.close();
      reader.current = null;
      setError(describeError(e));
      setStage({ kind: 'pick' });
    }
  };

  // The still frame with what the crew has tapped so far.
  useEffect(() => {
    const c = canvas.current;
    const bitmap = still.current;
    const probe = reader.current?.probe;
    if (!c || !bitmap || !probe || stage.kind !== 'setup') return;
    c.width = bitmap.width;
    c.height = bitmap.height;
    const ctx = c.getContext('2d');
    if (!ctx) return;
    ctx.drawImage(bitmap, 0, 0);
    const k = bitmap.width / probe.width_px;
    ctx.lineWidth = Math.max(2, bitmap.width / 200);
    const dot = (p: Point, colour: string) => {
      ctx.fillStyle = colour;
      ctx.beginPath();
      ctx.arc(p.x * k, p.y * k, ctx.lineWidth * 2.5, 0, 2 * Math.PI);
      ctx.fill();
    };
    if (taps[0]) dot(taps[0], '#e0342b');
    if (taps[1]) {
      ctx.strokeStyle = '#e0342b';
      ctx.beginPath();
      ctx.moveTo(taps[0]!.x * k, taps[0]!.y * k);
      ctx.lineTo(taps[1].x * k, taps[1].y * k);
      ctx.stroke();
      dot(taps[1], '#e0342b');
    }
    if (taps[2]) {
      ctx.strokeStyle = '#1f7ae0';
      ctx.beginPath();
      ctx.moveTo(0, taps[2].y * k);
      ctx.lineTo(c.width, taps[2].y * k);
      ctx.stroke();
    }
    for (const m of scale) {
      ctx.strokeStyle = '#f0b400';
      ctx.beginPath();
      ctx.moveTo(m.at.x * k - 20 * ctx.lineWidth, m.at.y * k);
      ctx.lineTo(m.at.x * k + 20 * ctx.lineWidth, m.at.y * k);
      ctx.stroke();
    }
  }, [stage, taps, scale]);

  const tapAt = (e: MouseEvent) => {
    const c = canvas.current;
    const probe = reader.current?.probe;
    if (!c || !probe) return;
    const box = c.getBoundingClientRect();
    const p = { x: ((e.clientX - box.left) / box.width) * probe.width_px, y: ((e.clientY - box.top) / box.height) * probe.height_px };
    // Functional updates: two quick taps arrive before the panel has drawn the first.
    if (taps.length < TAP_STEPS.length) setTaps((t) => (t.length < TAP_STEPS.length ? [...t, p] : t));
    else if (addingMark && scale.length < 3) {
      setScale((s) => (s.length < 3 ? [...s, { at: p, height: field() }] : s));
      setAddingMark(false);
    }
  };

  const setupOf = (): ClipSetup | null => {
    if (taps.length < 3) return null;
    const [top, bottom, landing] = taps as [Point, Point, Point];
    return {
      fall_line: { x0_px: top.x, y0_px: top.y, x1_px: bottom.x, y1_px: bottom.y },
      landing_y_px: landing.y,
      scale: scale.map((m) => ({ x_px: m.at.x, y_px: m.at.y, height_m: m.height.value! })),
      release_height_m: releaseHeight,
    };
  };
  const scaleReady = scale.length === 0 || (scale.length >= 2 && scale.every((m) => fieldsValid(m.height)));

  const run = async () => {
    const r = reader.current;
    const setup = setupOf();
    if (!r || !setup || !scaleReady) return;
    const abort = new AbortController();
    running.current = abort;
    setError(null);
    setStage({ kind: 'running', progress: null });
    try {
      const band = clipBand(setup, r.probe);
      const clip = await r.greyBand(band, { signal: abort.signal, onProgress: (progress) => setStage({ kind: 'running', progress }) });
      const finding = findFall(clip, setup);
      setStage({ kind: 'found', clip, setup, finding });
    } catch (e) {
      // A cancelled run stopped the worker: the clip is opened again from its still frame on the next pick.
      setError(abort.signal.aborted ? 'Cancelled: nothing was stored. Pick the clip again to time it.' : describeError(e));
      if (abort.signal.aborted) reset();
      else setStage({ kind: 'setup' });
    } finally {
      running.current = null;
    }
  };

  const probe = reader.current?.probe;
  return (
    <div class="video-entry" data-testid="video-entry">
      {stage.kind === 'pick' || stage.kind === 'opening' ? (
        <div class="btn-row">
          <label class="btn btn-big file-pick">
            Pick a clip
            <input type="file" accept="video/*" data-testid="clip-pick" disabled={stage.kind === 'opening'} onChange={(e) => void pick((e.target as HTMLInputElement).files?.[0])} />
          </label>
          <label class="btn file-pick">
            Film now
            <input type="file" accept="video/*" capture="environment" disabled={stage.kind === 'opening'} onChange={(e) => void pick((e.target as HTMLInputElement).files?.[0])} />
          </label>
        </div>
      ) : null}
      {stage.kind === 'pick' && !error ? (
        <p class="hint">
          Film the whole fall from the side, the phone still (on a stand if you can), slow motion if the camera has it. The clip stays on this phone; the drop keeps its timestamps, the
          tracked positions and six small frames.
        </p>
      ) : null}
      {stage.kind === 'opening' ? <p role="status">Reading the clip…</p> : null}
      {error ? <Notice tone="bad">{error}</Notice> : null}
      {saved ? (
        <p class="entry-saved" role="status" data-testid="clip-drop-saved">
          ✓ {saved}
        </p>
      ) : null}
      {probe && (stage.kind === 'setup' || stage.kind === 'running') ? (
        <>
          <p class="hint" data-testid="clip-facts">
            {probe.codec} · {probe.width_px} × {probe.height_px} · {formatRate(probe.frame_rate_hz)} frames/s · {probe.frame_count} frames · {probe.duration_s.toFixed(2)} s
          </p>
          {stage.kind === 'setup' ? (
            <p class="video-step" role="status" data-testid="tap-step">
              {taps.length < TAP_STEPS.length ? TAP_STEPS[taps.length] : addingMark ? 'Tap a mark of known height (tape, a pole’s band).' : 'Ready: read every frame, or add scale marks first.'}
            </p>
          ) : null}
          <canvas ref={canvas} class="video-still" data-testid="clip-still" onClick={stage.kind === 'setup' ? tapAt : undefined} aria-label="Still frame of the clip: tap to set the lines" />
          {stage.kind === 'setup' ? (
            <>
              {scale.map((m, i) => (
                <div class="two" key={i}>
                  <QField
                    label={`Height of scale mark ${i + 1} above the landing`}
                    kind="length"
                    compact
                    state={m.height}
                    {...inputRange(LIMITS.height_m)}
                    onChange={(height) => setScale(scale.map((s, j) => (j === i ? { ...s, height } : s)))}
                  />
                  <button type="button" class="btn btn-quiet btn-small" onClick={() => setScale(scale.filter((_, j) => j !== i))}>
                    Remove mark {i + 1}
                  </button>
                </div>
              ))}
              <div class="btn-row">
                {taps.length > 0 ? (
                  <button type="button" class="btn btn-quiet" onClick={() => (scale.length ? setScale(scale.slice(0, -1)) : setTaps(taps.slice(0, -1)))}>
                    Undo last tap
                  </button>
                ) : null}
                {taps.length === TAP_STEPS.length && scale.length < 3 ? (
                  <button type="button" class="btn btn-quiet" aria-pressed={addingMark} onClick={() => setAddingMark(!addingMark)}>
                    Add a scale mark
                  </button>
                ) : null}
              </div>
              {scale.length === 1 ? <p class="hint">Scale marks: two or three, or none (then the drop keeps its fall time only).</p> : null}
              <button type="button" class="btn btn-block btn-big" disabled={taps.length < TAP_STEPS.length || !scaleReady} onClick={() => void run()}>
                Read every frame
              </button>
              <button type="button" class="btn btn-quiet btn-block" onClick={reset}>
                Pick another clip
              </button>
            </>
          ) : (
            <div class="video-progress">
              <progress
                max={stage.progress?.frames_total ?? probe.frame_count}
                value={stage.progress?.frames_done ?? 0}
                aria-label="Frames read"
                data-testid="clip-progress"
              />
              <span>
                {stage.progress?.frames_done ?? 0} of {stage.progress?.frames_total ?? probe.frame_count} frames
              </span>
              <button type="button" class="btn btn-quiet" onClick={() => running.current?.abort()}>
                Cancel
              </button>
            </div>
          )}
        </>
      ) : null}
      {stage.kind === 'found' && probe ? (
        <FoundStrip
          key={`${stage.finding.release.time_s}`}
          clip={stage.clip}
          finding={stage.finding}
          probe={probe}
          setup={stage.setup}
          onMake={async (final, reasons) => {
            try {
              const found = stage.finding;
              const keyFrame = (frame: number) => keyFrameImage(stage.clip, frame, windowNear(found.track, frame, stage.clip));
              const first = clipDropFields(probe, stage.setup, found, keyFrame);
              let drop = await app.store.create('drop', {
                series_id: series.id,
                seq: nextSeq,
                height_m: null,
                excluded: false,
                exclusion_reason: null,
                note: '',
                captured_at: new Date().toISOString(),
                ...first.fields,
              });
              let u = first.u_time_s;
              // An instant moved by hand is a correction of the found drop, with the crew's reason in its history.
              if (reasons.length) {
                const moved = clipDropFields(probe, stage.setup, final, keyFrame);
                drop = await app.store.revise('drop', drop.id, moved.fields, reasons.join('; '), { expectedRev: drop.rev });
                u = moved.u_time_s;
              }
              offerUndo(`Drop ${drop.seq} added from the clip: ${app.format(drop.time_s, 'time')}`, [drop]);
              app.notifyChanged();
              const marks = drop.marks?.length ? `, ${drop.marks.length} marks along the fall` : '';
              setSaved(`Drop ${drop.seq} saved: ${app.format(drop.time_s, 'time')} ± ${app.format(u, 'time')} (from the clip${marks})`);
              reset();
            } catch (e) {
              setError(describeError(e));
            }
          }}
          onDiscard={reset}
        />
      ) : null}
    </div>
  );
}

/** The strip's square around the tracked body at a frame (or the nearest frame where it was found). */
function windowNear(track: TrackPoint[], frame: number, clip: GreyClip): StripWindow {
  let best: TrackPoint | null = null;
  for (const p of track) {
    if (p.y_px === null || p.x_px === null) continue;
    if (!best || Math.abs(p.frame - frame) < Math.abs(best.frame - frame)) best = p;
  }
  const x = best?.x_px ?? clip.x0_px + (clip.width * clip.step_px) / 2;
  const y = best?.y_px ?? clip.y0_px + (clip.height * clip.step_px) / 2;
  return stripWindow(clip, x, y);
}

function formatRate(hz: number): string {
  return Math.abs(hz - Math.round(hz)) < 0.05 ? String(Math.round(hz)) : hz.toFixed(2);
}

/** The strip of frames around each found instant: step through them, move an instant by hand, make the drop. */
function FoundStrip({
  clip,
  finding,
  probe,
  setup,
  onMake,
  onDiscard,
}: {
  clip: GreyClip;
  finding: Finding;
  probe: ClipProbe;
  setup: ClipSetup;
  onMake(final: Finding, reasons: string[]): Promise<void>;
  onDiscard(): void;
}) {
  const app = useApp();
  const [current, setCurrent] = useState(finding);
  const [moveError, setMoveError] = useState<string | null>(null);
  const { release, impact } = current;
  const u = fallTimeUncertainty(probe, setup, current);
  const [cursor, setCursor] = useState<{ which: 'release' | 'impact'; frame: number }>({ which: 'release', frame: finding.release.frame });
  const [reason, setReason] = useState('');
  const [reasons, setReasons] = useState<string[]>([]);
  const [busy, setBusy] = useState(false);
  const time_s = impact.time_s - release.time_s;
  const instant = cursor.which === 'release' ? release : impact;
  const moveTo = () => {
    try {
      const from = instant.time_s;
      const next = moveInstant(current, cursor.which, clip.times_s[cursor.frame]!);
      const moved = next[cursor.which];
      setCurrent(next);
      setMoveError(null);
      setReasons([...reasons, `${cursor.which} moved by hand from ${from.toFixed(5)} s to ${moved.time_s.toFixed(5)} s (frame ${moved.frame}): ${reason.trim()}`]);
      setReason('');
    } catch (e) {
      setMoveError(describeError(e));
    }
  };
  return (
    <div class="video-found" data-testid="clip-found">
      <p>
        Release at <strong data-testid="found-release" data-time-s={release.time_s} data-u-s={release.u_time_s}>{release.time_s.toFixed(4)} s</strong> (frame {release.frame}
        {release.by === 'moved' ? ', moved by hand' : ''}), impact at <strong data-testid="found-impact" data-time-s={impact.time_s} data-u-s={impact.u_time_s}>{impact.time_s.toFixed(4)} s</strong> (frame {impact.frame}
        {impact.by === 'moved' ? ', moved by hand' : ''}).
      </p>
      <p>
        Fall time <strong data-testid="found-time" data-time-s={time_s} data-u-s={u}>{app.format(time_s, 'time')}</strong> ± {app.format(u, 'time')} (standard uncertainty)
      </p>
      {(['release', 'impact'] as const).map((which) => (
        <Strip
          key={which}
          which={which}
          clip={clip}
          track={current.track}
          instant={which === 'release' ? release : impact}
          cursor={cursor.which === which ? cursor.frame : null}
          onPick={(frame) => setCursor({ which, frame })}
        />
      ))}
      <div class="btn-row video-stepper">
        <button type="button" class="btn btn-small" aria-label="Previous frame" disabled={cursor.frame <= 0} onClick={() => setCursor({ ...cursor, frame: cursor.frame - 1 })}>
          ◀ Frame
        </button>
        <span data-testid="cursor-frame">
          {cursor.which} strip: frame {cursor.frame} ({clip.times_s[cursor.frame]!.toFixed(4)} s)
        </span>
        <button
          type="button"
          class="btn btn-small"
          aria-label="Next frame"
          disabled={cursor.frame >= clip.frames.length - 1}
          onClick={() => setCursor({ ...cursor, frame: cursor.frame + 1 })}
        >
          Frame ▶
        </button>
      </div>
      {moveError ? <Notice tone="bad">{moveError}</Notice> : null}
      {cursor.frame !== instant.frame ? (
        <div class="video-move">
          <TextField id="move-reason" label={`Why the ${cursor.which} is at frame ${cursor.frame}`} value={reason} onInput={setReason} />
          <button type="button" class="btn" disabled={reason.trim().length === 0} onClick={moveTo}>
            Move the {cursor.which} here
          </button>
        </div>
      ) : null}
      <button
        type="button"
        class="btn btn-block btn-big"
        disabled={busy || !(time_s > 0)}
        onClick={async () => {
          setBusy(true);
          await onMake(current, reasons);
          setBusy(false);
        }}
      >
        Make the drop
      </button>
      <button type="button" class="btn btn-quiet btn-block" onClick={onDiscard}>
        Discard this clip
      </button>
    </div>
  );
}

function Strip({
  which,
  clip,
  track,
  instant,
  cursor,
  onPick,
}: {
  which: 'release' | 'impact';
  clip: GreyClip;
  track: TrackPoint[];
  instant: Finding['release'];
  cursor: number | null;
  onPick(frame: number): void;
}) {
  const centre = cursor ?? instant.frame;
  const frames: number[] = [];
  for (let f = centre - STRIP_SIDE; f <= centre + STRIP_SIDE; f++) if (f >= 0 && f < clip.frames.length) frames.push(f);
  const at = windowNear(track, instant.frame, clip);
  return (
    <figure class="video-strip" data-testid={`strip-${which}`}>
      <figcaption>Around the {which}</figcaption>
      <div class="video-strip-frames">
        {frames.map((f) => (
          <StripFrame key={f} clip={clip} frame={f} at={at} found={f === instant.frame} selected={f === cursor} onPick={() => onPick(f)} />
        ))}
      </div>
    </figure>
  );
}

function StripFrame({ clip, frame, at, found, selected, onPick }: { clip: GreyClip; frame: number; at: StripWindow; found: boolean; selected: boolean; onPick(): void }) {
  const ref = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    if (ref.current) paintGrey(ref.current, clip, frame, at);
  }, [clip, frame, at.left, at.top]);
  return (
    <button type="button" class={`video-frame${found ? ' is-found' : ''}${selected ? ' is-selected' : ''}`} aria-pressed={selected} aria-label={`Frame ${frame}${found ? ' (found)' : ''}`} onClick={onPick}>
      <canvas ref={ref} />
      <span>{frame}</span>
    </button>
  );
}

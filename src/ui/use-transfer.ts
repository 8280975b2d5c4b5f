/**
 * One long transfer at a time on a screen (an import, an export, a sync run), with its progress and a way to
 * cancel. The progress shows only once the transfer has run for SHOW_AFTER_MS: a quick one never flickers a bar.
 * Progress reports come at every step of the work; the screen is redrawn at most once a frame.
 */
import { useEffect, useRef, useState } from 'preact/hooks';
import type { TransferOptions, TransferProgress } from '../log';

/** A transfer shows its progress once it has lasted this long. */
export const SHOW_AFTER_MS = 500;

export interface TransferView {
  /** What the transfer is, for the bar's label: "Importing plummet-log-phoneB.json". */
  label: string;
  progress: TransferProgress | null;
  cancel(): void;
  cancelling: boolean;
  /** What the bar says once Cancel is tapped, until the transfer has stopped. */
  cancellingText: string;
}

/** Said while an import or an export stops: it writes nothing until its one transaction. */
export const CANCELLING_TEXT = 'Cancelling… nothing will be changed';

export interface Transfer {
  /** The transfer to show, or null (none running, or running for less than SHOW_AFTER_MS). */
  view: TransferView | null;
  /** Runs `work` with a signal and a progress listener; a second call while one runs is refused by the caller. */
  run<T>(label: string, work: (options: Required<TransferOptions>) => Promise<T>, wording?: { cancelling?: string }): Promise<T>;
  running: boolean;
}

export function useTransfer(): Transfer {
  const [view, setView] = useState<TransferView | null>(null);
  const [running, setRunning] = useState(false);
  const live = useRef(true);
  useEffect(
    () => () => {
      live.current = false;
    },
    [],
  );
  const run = async <T,>(label: string, work: (options: Required<TransferOptions>) => Promise<T>, wording: { cancelling?: string } = {}): Promise<T> => {
    const cancellingText = wording.cancelling ?? CANCELLING_TEXT;
    const controller = new AbortController();
    let latest: TransferProgress | null = null;
    let shown = false;
    let cancelling = false;
    let frame = 0;
    const draw = () => {
      frame = 0;
      if (shown && live.current) setView({ label, progress: latest, cancel, cancelling, cancellingText });
    };
    const cancel = () => {
      cancelling = true;
      controller.abort();
      draw();
    };
    const show = setTimeout(() => {
      shown = true;
      draw();
    }, SHOW_AFTER_MS);
    setRunning(true);
    try {
      return await work({
        signal: controller.signal,
        onProgress(progress) {
          latest = progress;
          if (shown && !frame) frame = requestAnimationFrame(draw);
        },
      });
    } finally {
      clearTimeout(show);
      if (frame) cancelAnimationFrame(frame);
      if (live.current) {
        setView(null);
        setRunning(false);
      }
    }
  };
  return { view, run, running };
}

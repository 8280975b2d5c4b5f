/**
 * What a long transfer is doing, in the crew's words: "Checking 12 400 of 100 000 records", "Uploading 3 of 12
 * parts to the office folder". Numbers are grouped
 * by thousands with a no-break space, as the SI brochure writes them (§5.4.4).
 */
import type { TransferProgress } from '../log';

const grouped = (n: number) => String(Math.round(n)).replace(/\B(?=(\d{3})+(?!\d))/g, '\u00a0');
const of = (p: TransferProgress, unit: string, units = `${unit}s`) =>
  p.total > 0 ? `${grouped(p.done)} of ${grouped(p.total)} ${p.total === 1 ? unit : units}` : '';

export function progressText(p: TransferProgress): string {
  switch (p.phase) {
    case 'reading':
      return p.total > 0 ? `Reading ${of(p, 'record')}` : 'Reading the log on this phone';
    case 'checking':
      return `Checking ${of(p, 'record') || 'the file'}`;
    case 'merging':
      return p.total > 0 ? `Merging ${grouped(p.total)} record${p.total === 1 ? '' : 's'} with this log` : 'Merging with this log';
    case 'writing':
      return `Saving ${of(p, 'record') || 'the records'}`;
    case 'exporting':
      return `Writing the file${p.total > 0 ? `: ${of(p, 'record')}` : ''}`;
    case 'listing':
      return 'Looking at the office folder';
    case 'downloading':
      return `Reading ${of(p, 'file') || 'files'} from the office folder`;
    case 'uploading':
      return `Uploading ${of(p, 'part') || 'this phone’s log'} to the office folder`;
    case 'indexing':
      return 'Writing the list of this phone’s parts in the office folder';
    case 'computing':
      return `Computing ${of(p, 'series', 'series') || 'the tables'}`;
  }
}

/** How far along, 0 to 1; null when the phase has no count (the bar then shows no fraction). */
export function progressFraction(p: TransferProgress): number | null {
  if (p.total <= 0) return null;
  return Math.min(1, Math.max(0, p.done / p.total));
}

/** Said while a sync stops: at its next request or write; what it has done stays done. */
export const SYNC_CANCELLING_TEXT = 'Cancelling… stopping at the next safe point';
/** Said once a sync has stopped: the log on the phone is whole either way, and what is unsent goes next time. */
export const SYNC_CANCELLED_TEXT =
  'Sync cancelled. The log on this phone is whole: what was read from the folder was merged completely or not at all. Whatever was not sent yet goes at the next sync.';

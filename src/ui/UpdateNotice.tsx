import type { UpdateHandle } from './service-worker';
import { flushAllDrafts } from './draft-registry';

/**
 * A small notice at the bottom when a new version waits. It never switches by itself: only the tap does,
 * after every open form has saved its draft, so nobody loses an entry to an update.
 */
export function UpdateNotice({ update, onDismiss }: { update: UpdateHandle; onDismiss: () => void }) {
  return (
    <div class="update-notice" role="status">
      <span>A new version of Plummet is ready.</span>
      <button
        type="button"
        class="btn btn-small"
        onClick={async () => {
          await flushAllDrafts();
          update.apply();
        }}
      >
        Switch now
      </button>
      <button type="button" class="btn btn-small btn-quiet" onClick={onDismiss} aria-label="Later">
        Later
      </button>
    </div>
  );
}

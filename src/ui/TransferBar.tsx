import { useLayoutEffect, useRef } from 'preact/hooks';
import { progressFraction, progressText } from './progress-text';
import type { TransferView } from './use-transfer';

/**
 * A long transfer's progress bar with its Cancel button. The bar's width is set through the element's style
 * object (the security policy allows no style attribute); without a count the bar shows a moving stripe.
 */
export function TransferBar({ view }: { view: TransferView }) {
  const bar = useRef<HTMLSpanElement>(null);
  const frame = useRef<HTMLDivElement>(null);
  // Brought into view once, when it appears: the crew may be scrolled to the button that started the transfer.
  useLayoutEffect(() => frame.current?.scrollIntoView?.({ block: 'nearest' }), []);
  const fraction = view.progress ? progressFraction(view.progress) : null;
  const text = view.cancelling ? view.cancellingText : view.progress ? progressText(view.progress) : 'Starting';
  const percent = fraction === null ? null : Math.floor(fraction * 100);
  useLayoutEffect(() => {
    if (bar.current) bar.current.style.width = fraction === null ? '' : `${(fraction * 100).toFixed(1)}%`;
  }, [fraction]);
  return (
    <div ref={frame} class="transfer" role="group" aria-label={view.label} data-testid="transfer">
      <p class="transfer-label">
        <strong>{view.label}</strong>
        <br />
        <span id="transfer-text">{text}{percent === null ? '' : ` (${percent} %)`}</span>
      </p>
      <div
        class={`transfer-track${fraction === null ? ' transfer-unknown' : ''}`}
        role="progressbar"
        aria-labelledby="transfer-text"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        aria-valuetext={text}
      >
        <span ref={bar} class="transfer-fill" />
      </div>
      <button type="button" class="btn btn-quiet transfer-cancel" onClick={view.cancel} disabled={view.cancelling}>
        {view.cancelling ? 'Cancelling…' : 'Cancel'}
      </button>
    </div>
  );
}

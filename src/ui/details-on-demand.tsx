import type { ComponentChildren } from 'preact';
import { useState } from 'preact/hooks';

/**
 * A <details> whose body is rendered only once it has been opened (and kept from then on, so a half-filled form
 * survives closing it). A closed panel's lazily loaded parts (correcting, restoring) are then not fetched with
 * the screen: the browser renders a closed <details>' children all the same, and rendering is what loads them.
 */
export function DetailsOnDemand({ class: className, summary, children }: { class: string; summary: ComponentChildren; children: ComponentChildren }) {
  const [opened, setOpened] = useState(false);
  return (
    <details class={className} onToggle={(e) => (e.currentTarget as HTMLDetailsElement).open && setOpened(true)}>
      {summary}
      {opened ? children : null}
    </details>
  );
}

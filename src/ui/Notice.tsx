import type { ComponentChildren } from 'preact';

/** A message box: a warning, a failure (announced to screen readers), a success or a piece of information. */
export function Notice({ tone, children, title }: { tone: 'warn' | 'bad' | 'good' | 'info'; children: ComponentChildren; title?: string }) {
  return (
    <div class={`notice notice-${tone}`} role={tone === 'bad' ? 'alert' : undefined}>
      {title ? <strong class="notice-title">{title}</strong> : null}
      <div>{children}</div>
    </div>
  );
}

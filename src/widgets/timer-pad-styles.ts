// The timer pad's look: big targets for a gloved thumb, the time in large tabular figures, the theme's colours.
import { css } from 'lit';

export const timerPadStyles = css`
  :host {
    display: block;
    font: inherit;
    color: var(--pl-ink, #111);
    margin: 0 0 var(--pl-gap, 0.9rem);
  }
  .pad {
    border: 2px solid var(--pl-line, #444);
    border-radius: 12px;
    padding: 0.75rem;
    background: var(--pl-field, #fff);
  }
  .title {
    font-weight: 600;
    margin: 0 0 0.5rem;
  }
  .modes {
    display: flex;
    gap: 0.5rem;
    margin-bottom: 0.75rem;
  }
  button {
    font: inherit;
    color: inherit;
    border-radius: 10px;
    border: 2px solid var(--pl-line, #444);
    background: var(--pl-field, #fff);
    touch-action: manipulation;
    -webkit-tap-highlight-color: transparent;
    user-select: none;
  }
  button:focus-visible {
    outline: 4px solid var(--pl-focus, #f2a900);
    outline-offset: 2px;
  }
  button:disabled {
    opacity: 0.5;
  }
  .mode {
    flex: 1;
    min-height: 48px;
    font-weight: 600;
  }
  .mode[aria-pressed='true'] {
    background: var(--pl-brand, #0b3d2e);
    border-color: var(--pl-brand, #0b3d2e);
    color: var(--pl-brand-ink, #fff);
  }
  .time {
    font-size: 3.2rem;
    line-height: 1.1;
    font-weight: 700;
    font-variant-numeric: tabular-nums;
    text-align: center;
    margin: 0.25rem 0 0.5rem;
    min-height: 1.1em;
  }
  .time .unit {
    font-size: 1.6rem;
    font-weight: 600;
  }
  .big {
    display: grid;
    grid-template-columns: 1fr 1fr;
    gap: 0.75rem;
  }
  .big.one {
    grid-template-columns: 1fr;
  }
  .target {
    min-height: 96px;
    min-width: 64px;
    font-size: 1.5rem;
    font-weight: 700;
  }
  .target.release[data-armed] {
    background: var(--pl-good-bg, #dcefe6);
  }
  .status {
    margin: 0.6rem 0 0;
    font-size: 0.95rem;
    color: var(--pl-ink-soft, #333);
    min-height: 1.3em;
  }
  .problem {
    margin: 0.5rem 0 0;
    font-weight: 600;
    color: var(--pl-bad, #b00020);
  }
`;

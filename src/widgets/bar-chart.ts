import { LitElement, css, html } from 'lit';
import { barWidths, type Bar } from '../charts';

export type { Bar } from '../charts';

/**
 * `<pl-bars>`: horizontal bars, largest first, each labelled with its value as text. The bars are a
 * description list too, so the text alternative is the chart itself.
 */
export class BarChart extends LitElement {
  static override properties = {
    bars: { attribute: false },
    heading: { type: String },
  };

  declare bars: readonly Omit<Bar, 'widthPct'>[];
  declare heading: string;

  constructor() {
    super();
    this.bars = [];
    this.heading = '';
  }

  static override styles = css`
    :host {
      display: block;
      color: var(--pl-ink, #111);
    }
    dl {
      margin: 0;
      display: grid;
      grid-template-columns: minmax(7rem, 40%) 1fr;
      gap: 0.35rem 0.6rem;
      align-items: center;
    }
    dt {
      font-size: 0.92rem;
      overflow-wrap: anywhere;
    }
    dd {
      margin: 0;
      display: flex;
      align-items: center;
      gap: 0.4rem;
      min-width: 0;
    }
    .bar {
      height: 18px;
      min-width: 2px;
      background: var(--pl-brand-line, #0b6b4f);
      border-radius: 3px;
    }
    .val {
      font-size: 0.88rem;
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
  `;

  // The width is set through the element's style object (a property binding: `el.style = text` sets
  // style.cssText), which the Content-Security-Policy allows; a style="" attribute, even from Lit's styleMap on
  // its first render, would need style-src 'unsafe-inline'.
  override render() {
    // Widths from the shared chart geometry (src/charts), the printed report's too.
    const sorted = barWidths(this.bars);
    return html`
      <dl aria-label=${this.heading}>
        ${sorted.map(
          (b) => html`<dt>${b.label}</dt>
            <dd><span class="bar" .style=${`width:${b.widthPct}%`}></span><span class="val">${b.text}</span></dd>`,
        )}
      </dl>
    `;
  }
}

if (!customElements.get('pl-bars')) customElements.define('pl-bars', BarChart);

declare global {
  interface HTMLElementTagNameMap {
    'pl-bars': BarChart;
  }
}

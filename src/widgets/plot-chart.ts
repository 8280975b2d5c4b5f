import { LitElement, css, html, svg, nothing } from 'lit';
import { plotGeometry, type PlotLine, type PlotMark } from '../charts';

export type { PlotLine, PlotMark } from '../charts';
export { niceTicks } from '../charts';

/**
 * `<pl-plot>`: a line-and-point chart drawn in SVG, readable in sunlight (thick strokes, high contrast, no
 * colour-only cues). Its text alternative is `summary` (read by screen readers) and the data table the
 * screen shows beside it.
 */
export class PlotChart extends LitElement {
  static override properties = {
    lines: { attribute: false },
    marks: { attribute: false },
    xLabel: { type: String, attribute: 'x-label' },
    yLabel: { type: String, attribute: 'y-label' },
    summary: { type: String },
    zeroLine: { type: Boolean, attribute: 'zero-line' },
  };

  declare lines: PlotLine[];
  declare marks: PlotMark[];
  declare xLabel: string;
  declare yLabel: string;
  declare summary: string;
  declare zeroLine: boolean;

  constructor() {
    super();
    this.lines = [];
    this.marks = [];
    this.xLabel = '';
    this.yLabel = '';
    this.summary = '';
    this.zeroLine = false;
  }

  static override styles = css`
    :host {
      display: block;
      color: var(--pl-ink, #111);
    }
    figure {
      margin: 0;
    }
    svg {
      width: 100%;
      height: auto;
      display: block;
      background: var(--pl-surface, #fff);
      border: 1px solid var(--pl-line-soft, #888);
      border-radius: 8px;
    }
    .axis {
      stroke: currentColor;
      stroke-width: 1.5;
    }
    .grid {
      stroke: var(--pl-line-soft, #999);
      stroke-width: 0.6;
      stroke-dasharray: 2 3;
    }
    text {
      fill: currentColor;
      font: 12px system-ui, sans-serif;
    }
    .line {
      fill: none;
      stroke-width: 3;
      stroke-linejoin: round;
    }
    .brand {
      stroke: var(--pl-brand-line, #0b6b4f);
    }
    .accent {
      stroke: var(--pl-accent-line, #b86e00);
    }
    .ink {
      stroke: var(--pl-ink, #111);
    }
    .soft {
      stroke: var(--pl-ink-soft, #555);
    }
    .dash {
      stroke-dasharray: 9 6;
    }
    .dot {
      stroke-dasharray: 2 5;
      stroke-linecap: round;
    }
    .mark {
      fill: var(--pl-ink, #111);
      stroke: var(--pl-surface, #fff);
      stroke-width: 1.5;
    }
    .mark.hollow {
      fill: var(--pl-surface, #fff);
      stroke: var(--pl-ink, #111);
      stroke-width: 2;
    }
    .errbar {
      stroke: var(--pl-ink, #111);
      stroke-width: 1.5;
    }
    .legend {
      display: flex;
      flex-wrap: wrap;
      gap: 0.3rem 1rem;
      margin: 0.4rem 0 0;
      padding: 0;
      list-style: none;
      font-size: 0.9rem;
    }
    .legend svg {
      display: inline-block;
      width: 30px;
      height: 12px;
      border: 0;
      background: none;
      vertical-align: middle;
      margin-right: 0.3rem;
    }
  `;

  // The geometry (scales, ticks, points) is the pure one the printed report uses too (src/charts).
  override render() {
    const g = plotGeometry({ lines: this.lines, marks: this.marks, zeroLine: this.zeroLine });
    if (!g) {
      return html`<p>No data to plot yet.</p>`;
    }
    return html`
      <figure>
        <svg viewBox="0 0 ${g.width} ${g.height}" role="img" aria-label=${this.summary || `${this.yLabel} against ${this.xLabel}`}>
          ${g.yTicks.map((t) => svg`<line class="grid" x1=${g.left} x2=${g.right} y1=${t.at} y2=${t.at}></line>
            <text x=${g.left - 6} y=${t.at + 4} text-anchor="end">${t.label}</text>`)}
          ${g.xTicks.map((t) => svg`<line class="grid" y1=${g.top} y2=${g.bottom} x1=${t.at} x2=${t.at}></line>
            <text x=${t.at} y=${g.bottom + 16} text-anchor="middle">${t.label}</text>`)}
          ${g.zeroY !== null ? svg`<line class="axis" x1=${g.left} x2=${g.right} y1=${g.zeroY} y2=${g.zeroY}></line>` : nothing}
          <line class="axis" x1=${g.left} x2=${g.left} y1=${g.top} y2=${g.bottom}></line>
          <line class="axis" x1=${g.left} x2=${g.right} y1=${g.bottom} y2=${g.bottom}></line>
          <text x=${g.xLabelAt.x} y=${g.xLabelAt.y} text-anchor="middle">${this.xLabel}</text>
          <text transform="translate(${g.yLabelAt.x} ${g.yLabelAt.y}) rotate(-90)" text-anchor="middle">${this.yLabel}</text>
          ${g.lines.map((l) => svg`<polyline class="line ${l.tone} ${l.style}" points=${l.points}></polyline>`)}
          ${g.marks.map(
            (m) => svg`${m.errorBar ? svg`<line class="errbar" x1=${m.cx} x2=${m.cx} y1=${m.errorBar.y1} y2=${m.errorBar.y2}></line>` : nothing}
              <circle class="mark ${m.hollow ? 'hollow' : ''}" cx=${m.cx} cy=${m.cy} r="5"><title>${m.label}</title></circle>`,
          )}
        </svg>
        <ul class="legend" aria-hidden="true">
          ${this.lines.map(
            (l) => html`<li><svg viewBox="0 0 30 12"><line class="line ${l.tone ?? 'brand'} ${l.style ?? 'solid'}" x1="1" x2="29" y1="6" y2="6"></line></svg>${l.label}</li>`,
          )}
          ${this.marks.length
            ? html`<li><svg viewBox="0 0 30 12"><circle class="mark" cx="15" cy="6" r="5"></circle></svg>measured</li>`
            : nothing}
          ${this.marks.some((m) => m.hollow)
            ? html`<li><svg viewBox="0 0 30 12"><circle class="mark hollow" cx="15" cy="6" r="4.5"></circle></svg>excluded</li>`
            : nothing}
        </ul>
      </figure>
    `;
  }
}

if (!customElements.get('pl-plot')) customElements.define('pl-plot', PlotChart);

declare global {
  interface HTMLElementTagNameMap {
    'pl-plot': PlotChart;
  }
}

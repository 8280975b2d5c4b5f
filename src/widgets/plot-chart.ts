import { LitElement, css, html, svg, nothing } from 'lit';

export interface PlotLine {
  label: string;
  points: ReadonlyArray<readonly [number, number]>;
  /** 'solid' | 'dash' | 'dot'; each line also differs by stroke so colour is never the only cue. */
  style?: 'solid' | 'dash' | 'dot';
  tone?: 'brand' | 'accent' | 'ink' | 'soft';
}

export interface PlotMark {
  label: string;
  x: number;
  y: number;
  /** Hollow marks for points left out of the fit (excluded drops). */
  hollow?: boolean;
  /** An error bar half-height in y units. */
  yError?: number;
}

const W = 360;
const H = 240;
const PAD = { left: 52, right: 12, top: 12, bottom: 40 };

/** Rounded tick values covering [lo, hi]. */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const ticks: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

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

  override render() {
    const xs = [...this.lines.flatMap((l) => l.points.map((p) => p[0])), ...this.marks.map((m) => m.x)];
    const ys = [
      ...this.lines.flatMap((l) => l.points.map((p) => p[1])),
      ...this.marks.flatMap((m) => [m.y - (m.yError ?? 0), m.y + (m.yError ?? 0)]),
      ...(this.zeroLine ? [0] : []),
    ];
    const finite = (a: number[]) => a.filter(Number.isFinite);
    const fx = finite(xs);
    const fy = finite(ys);
    if (fx.length === 0 || fy.length === 0) {
      return html`<p>No data to plot yet.</p>`;
    }
    let [x0, x1] = [Math.min(0, ...fx), Math.max(...fx)];
    let [y0, y1] = [Math.min(...fy), Math.max(...fy)];
    if (x1 === x0) x1 = x0 + 1;
    if (y1 === y0) {
      y0 -= Math.abs(y0) * 0.1 || 1;
      y1 += Math.abs(y1) * 0.1 || 1;
    }
    const yPad = (y1 - y0) * 0.06;
    y0 -= this.zeroLine || y0 !== 0 ? yPad : 0;
    y1 += yPad;
    const sx = (x: number) => PAD.left + ((x - x0) / (x1 - x0)) * (W - PAD.left - PAD.right);
    const sy = (y: number) => H - PAD.bottom - ((y - y0) / (y1 - y0)) * (H - PAD.top - PAD.bottom);
    const xt = niceTicks(x0, x1);
    const yt = niceTicks(y0, y1);
    const fmt = (v: number) => String(Number(v.toPrecision(3)));
    return html`
      <figure>
        <svg viewBox="0 0 ${W} ${H}" role="img" aria-label=${this.summary || `${this.yLabel} against ${this.xLabel}`}>
          ${yt.map((v) => svg`<line class="grid" x1=${PAD.left} x2=${W - PAD.right} y1=${sy(v)} y2=${sy(v)}></line>
            <text x=${PAD.left - 6} y=${sy(v) + 4} text-anchor="end">${fmt(v)}</text>`)}
          ${xt.map((v) => svg`<line class="grid" y1=${PAD.top} y2=${H - PAD.bottom} x1=${sx(v)} x2=${sx(v)}></line>
            <text x=${sx(v)} y=${H - PAD.bottom + 16} text-anchor="middle">${fmt(v)}</text>`)}
          ${this.zeroLine ? svg`<line class="axis" x1=${PAD.left} x2=${W - PAD.right} y1=${sy(0)} y2=${sy(0)}></line>` : nothing}
          <line class="axis" x1=${PAD.left} x2=${PAD.left} y1=${PAD.top} y2=${H - PAD.bottom}></line>
          <line class="axis" x1=${PAD.left} x2=${W - PAD.right} y1=${H - PAD.bottom} y2=${H - PAD.bottom}></line>
          <text x=${(PAD.left + W - PAD.right) / 2} y=${H - 6} text-anchor="middle">${this.xLabel}</text>
          <text transform="translate(13 ${(PAD.top + H - PAD.bottom) / 2}) rotate(-90)" text-anchor="middle">${this.yLabel}</text>
          ${this.lines.map(
            (l) => svg`<polyline class="line ${l.tone ?? 'brand'} ${l.style ?? 'solid'}"
              points=${l.points.filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1])).map((p) => `${sx(p[0]).toFixed(1)},${sy(p[1]).toFixed(1)}`).join(' ')}></polyline>`,
          )}
          ${this.marks.map(
            (m) => svg`${m.yError ? svg`<line class="errbar" x1=${sx(m.x)} x2=${sx(m.x)} y1=${sy(m.y - m.yError)} y2=${sy(m.y + m.yError)}></line>` : nothing}
              <circle class="mark ${m.hollow ? 'hollow' : ''}" cx=${sx(m.x)} cy=${sy(m.y)} r="5"><title>${m.label}</title></circle>`,
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

import { describe, expect, it } from 'vitest';
import { barWidths, niceTicks, plotGeometry, tickLabel } from '../../src/charts';

describe('nice ticks', () => {
  // Steps of 1, 2, 2.5 or 5 times a power of ten are the usual choice for axis labels (common practice;
  // Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990, uses 1, 2 and 5).
  it('covers 0 to 1 in steps of 0.2', () => {
    expect(niceTicks(0, 1)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
  });
  it('covers 0 to 1.43 in steps of 0.5 and stays inside the range', () => {
    expect(niceTicks(0, 1.43)).toEqual([0, 0.5, 1]);
  });
  it('covers a negative range without floating-point dust', () => {
    expect(niceTicks(-7.3, 12.1)).toEqual([-5, 0, 5, 10]);
  });
  it('gives the single value of an empty range', () => {
    expect(niceTicks(3, 3)).toEqual([3]);
  });
});

describe('the plot geometry', () => {
  const line = { label: 'l', points: [[0, 0], [1, 5], [2, 20]] as const };

  it('has nothing to draw without a finite point', () => {
    expect(plotGeometry({ lines: [], marks: [] })).toBeNull();
    expect(plotGeometry({ lines: [{ label: 'x', points: [[Number.NaN, 1]] }], marks: [] })).toBeNull();
  });

  it('maps x from 0 to the largest x across the plotting area, and y upwards', () => {
    const g = plotGeometry({ lines: [line], marks: [] })!;
    const pts = g.lines[0]!.points.split(' ').map((p) => p.split(',').map(Number));
    expect(pts[0]![0]).toBeCloseTo(g.left, 1);
    expect(pts[2]![0]).toBeCloseTo(g.right, 1);
    // y runs from 0 (no padding under a range that starts at 0) to 20 plus 6 % padding.
    expect(pts[0]![1]).toBeCloseTo(g.bottom, 1);
    const top = g.bottom - (20 / 21.2) * (g.bottom - g.top);
    expect(pts[2]![1]).toBeCloseTo(top, 1);
    expect(g.xTicks.map((t) => t.value)).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(g.xTicks[0]!.at).toBeCloseTo(g.left, 9);
  });

  it('keeps zero inside a residual chart and draws the zero line there', () => {
    const g = plotGeometry({ lines: [], marks: [{ label: 'a', x: 5, y: 2, yError: 1 }, { label: 'b', x: 10, y: 4, yError: 1 }], zeroLine: true })!;
    expect(g.zeroY).not.toBeNull();
    expect(g.zeroY!).toBeLessThan(g.bottom);
    expect(g.zeroY!).toBeGreaterThan(g.marks[0]!.cy);
    const bar = g.marks[0]!.errorBar!;
    // The bar is ±1 around y = 2: symmetric about the mark.
    expect((bar.y1 + bar.y2) / 2).toBeCloseTo(g.marks[0]!.cy, 9);
  });

  it('leaves non-finite points out of a line and marks hollow points', () => {
    const g = plotGeometry({ lines: [{ label: 'l', points: [[0, 0], [1, Number.POSITIVE_INFINITY], [2, 1]] }], marks: [{ label: 'x', x: 1, y: 1, hollow: true }] })!;
    expect(g.lines[0]!.points.split(' ')).toHaveLength(2);
    expect(g.marks[0]!.hollow).toBe(true);
  });

  it('prints tick values with three significant digits', () => {
    expect(tickLabel(0.30000000000000004)).toBe('0.3');
    expect(tickLabel(12345)).toBe('12300');
  });
});

describe('bar widths', () => {
  it('sorts largest first and scales the largest to 62 %, none below 0.5 %', () => {
    const bars = barWidths([
      { label: 'a', value: 1, text: '' },
      { label: 'b', value: 4, text: '' },
      { label: 'c', value: 0.001, text: '' },
    ]);
    expect(bars.map((b) => b.label)).toEqual(['b', 'a', 'c']);
    expect(bars.map((b) => b.widthPct)).toEqual([62, 15.5, 0.5]);
  });
});

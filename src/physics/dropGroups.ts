/** Drops grouped by release height, in order of first appearance: the model fits one mean time per height. */
import type { DropInput } from './analysisTypes';
import { seriesStatistics } from './seriesStatistics';

export interface DropGroups {
  /** The distinct heights, m. */
  heights: number[];
  /** For each height, the indices of its drops in the series. */
  members: number[][];
  /** Drops per height. */
  counts: Float64Array;
  /** For each height, its drops' times, s. */
  times: number[][];
  /** For each height, the mean of its drops' times, s. */
  meanTimes: number[];
}

export function groupDrops(drops: readonly DropInput[]): DropGroups {
  const groupOf = new Map<number, number>();
  const heights: number[] = [];
  const members: number[][] = [];
  drops.forEach((drop, i) => {
    let j = groupOf.get(drop.height_m);
    if (j === undefined) {
      j = heights.length;
      groupOf.set(drop.height_m, j);
      heights.push(drop.height_m);
      members.push([]);
    }
    members[j]!.push(i);
  });
  const counts = Float64Array.from(members, (d) => d.length);
  const times = members.map((indices) => indices.map((i) => drops[i]!.time_s));
  const meanTimes = times.map((t) => seriesStatistics(t).mean);
  return { heights, members, counts, times, meanTimes };
}

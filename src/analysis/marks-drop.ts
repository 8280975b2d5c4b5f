// A drop typed as marks along the fall (gate times, or distance/time pairs): the checks a person needs named mark by
// mark, and the drop record's own time and height. Pure; the entry form words the problems in the crew's units.
import { LIMITS, LIST_LIMITS, type DropMark } from '../log';

/** One problem with a typed mark: which mark (from 0), which of its values, the value and the rule broken. */
export interface TypedMarkProblem {
  index: number;
  field: 'distance_m' | 'time_s';
  value: number;
  /** 'range': outside the catalogue's limit; 'order': not above the mark before; 'height': beyond the release height. */
  rule: 'range' | 'order' | 'height';
  /** The bound broken: the limit's edge, the mark before's value, or the release height. */
  bound: number;
}

/**
 * The problems of typed marks, in order: each distance and time in the catalogue's range (LIMITS.mark_distance_m,
 * LIMITS.mark_time_s), strictly increasing, and no distance beyond the release height. Empty: they may be stored.
 */
export function typedMarkProblems(marks: readonly DropMark[], releaseHeight_m: number): TypedMarkProblem[] {
  const problems: TypedMarkProblem[] = [];
  const limits = { distance_m: LIMITS.mark_distance_m, time_s: LIMITS.mark_time_s } as const;
  marks.forEach((mark, index) => {
    for (const field of ['distance_m', 'time_s'] as const) {
      const value = mark[field];
      const limit = limits[field];
      if (value < limit.min || value > limit.max) problems.push({ index, field, value, rule: 'range', bound: value < limit.min ? limit.min : limit.max });
      else if (index > 0 && value <= marks[index - 1]![field]) problems.push({ index, field, value, rule: 'order', bound: marks[index - 1]![field] });
    }
    if (mark.distance_m > releaseHeight_m) problems.push({ index, field: 'distance_m', value: mark.distance_m, rule: 'height', bound: releaseHeight_m });
  });
  return problems;
}

/** Whether the count of marks is one a drop may carry. */
export const markCountAllowed = (count: number): boolean => count >= LIST_LIMITS.marks_min && count <= LIST_LIMITS.marks_max;

/**
 * The drop record of typed marks: the landing is the last mark (a gate at the landing surface, or the last typed
 * point), so time_s is its time and height_m its distance, or null when that is the series' release height.
 */
export function dropOfMarks(marks: readonly DropMark[], seriesHeight_m: number): { marks: DropMark[]; time_s: number; height_m: number | null } {
  const last = marks[marks.length - 1]!;
  return {
    marks: marks.map((m) => ({ distance_m: m.distance_m, time_s: m.time_s })),
    time_s: last.time_s,
    height_m: last.distance_m === seriesHeight_m ? null : last.distance_m,
  };
}

/**
 * The one error type motion/ throws for frames or taps it cannot use. Like every layer's error it names the field
 * the value came from ("clip.frames", "setup.scale[1].y_px"), the value and what was looked for; screens and tests
 * match on `code`, never on the message.
 */
import { formatValue, PlummetError, type PlummetErrorOptions } from '../errors';

export type MotionErrorCode =
  /** No body moved down the fall line in the whole clip. */
  | 'nothing-falls'
  /** Something falls, but the clip does not show it at rest before it goes. */
  | 'no-release'
  /** Something falls, but the clip does not show it reaching the landing line. */
  | 'no-impact'
  /** The fall line, the landing line or the frames do not fit together (outside the band, too few frames). */
  | 'bad-setup'
  /** The scale marks cannot give heights (not 0, 2 or 3 of them, two on one row, a map that folds over). */
  | 'bad-scale'
  /** An instant moved by hand outside the clip, or a release after the impact. */
  | 'bad-instant'
  /** Evidence too large to keep (too many frames, too many or too large key frames, not an image). */
  | 'bad-evidence';

export interface MotionErrorDetails extends PlummetErrorOptions<MotionErrorCode> {
  field: string;
  allowed: string;
  /** What is wrong, in plain words. */
  reason: string;
}

export class MotionError extends PlummetError<MotionErrorCode> {
  declare readonly field: string;
  declare readonly allowed: string;
  /** The plain-words part of the message, without field and range (for short notices). */
  readonly reason: string;

  constructor(details: MotionErrorDetails) {
    super({ ...details, message: details.message ?? `${details.field} = ${formatValue(details.value)}: ${details.reason}; looked for: ${details.allowed}` });
    this.name = 'MotionError';
    this.reason = details.reason;
  }
}

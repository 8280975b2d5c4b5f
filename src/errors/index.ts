/** The one coded error base every layer's errors extend. Pure: imports nothing of ours, no platform API. */
export { PlummetError, type PlummetErrorOptions, type PlummetErrorJson } from './plummet-error';
export { describeError } from './describe-error';
export { formatValue } from './format-value';

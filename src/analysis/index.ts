// The bridge between the log's records and the physics core: every trip from records to a physics request and
// back. Pure, used by the screens, the CSV export and the office command alike.
export * from './series-request';
export * from './series-analysis';
export * from './vacuum-check';
export * from './series-verdict';
export * from './series-computer';
export * from './drop-rows';
export * from './series-curves';
export * from './plan-request';
export * from './series-key';
export * from './reading-air';
export * from './marks-drop';

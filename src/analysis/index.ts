// The bridge between the log's records and the physics core: pure, used by the screens, the CSV export and the
// office command alike.
export * from './series-analysis';
export * from './series-curves';

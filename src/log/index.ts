// The record model of a test log: pure data and functions, no storage, no network, no DOM.
export * from './types';
export * from './hlc';
export * from './clock-ahead';
export * from './version-order';
export * from './errors';
export * from './uuid';
export * from './fields';
export * from './validate';
export * from './records';
export * from './canonical';
export * from './schema';
export * from './export';
export * from './export-parse';
export * from './upgrade-export';
export * from './merge';
export * from './csv';
export * from './csv-tables';

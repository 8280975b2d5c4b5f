// Getting logs off the phone and back: sharing files, importing them, and syncing the office WebDAV folder.
// This face is worker-safe (the service worker imports it); sharing and picking files are in ./page.
export * from './errors';
export * from './shareable-file';
export * from './folder-url';
export * from './basic-auth';
export * from './xml';
export * from './multistatus';
export * from './webdav-client';
export * from './content-hash';
export * from './record-source';
export * from './settings';
export * from './sync-state';
export * from './file-problem';
export * from './import-log';
export * from './sync-run';
export * from './scheduler';
export * from './auto-sync';
export * from './csv-export';
export * from './send-log';
export * from './send-records';

// Getting logs off the phone and back: sharing files, importing them, and syncing the office WebDAV folder.
export * from './errors';
export * from './folder-url';
export * from './basic-auth';
export * from './xml';
export * from './multistatus';
export * from './webdav-client';
export * from './content-hash';
export * from './record-source';
export * from './settings';
export * from './sync-state';
export * from './import-log';
export * from './sync-run';
export * from './scheduler';
export * from './share';
export * from './auto-sync';
export * from './csv-export';
export * from './send-log';

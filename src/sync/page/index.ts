// Sync's page-only face: handing files to the phone's share sheet or a download, and picking a file to import.
// Kept apart from ../index.ts, which the service worker imports and which must not reach for document.
export * from './share';

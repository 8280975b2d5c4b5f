// The store's page-only face: the browser page's own facilities (display mode, localStorage as the loss witness).
// Kept apart from ../index.ts so the service worker and sync/ import the store without reaching for page globals.
export { browserEnvironment } from './browser-environment';

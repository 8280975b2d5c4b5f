// The app shell and its screens (Preact). Everything the page needs to start is mounted from here.
export { mountApp } from './mount';
export { parseRoute, routeHref, type Route, type ScreenName } from './router';

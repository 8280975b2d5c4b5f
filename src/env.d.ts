/// <reference types="vite/client" />

/** The package version, fixed at build time. */
declare const __APP_VERSION__: string;
/** Identifies one build (the version, or PLUMMET_BUILD_ID when the tests set it). */
declare const __BUILD_ID__: string;

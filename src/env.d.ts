/// <reference types="vite/client" />

/** The package version, fixed at build time. */
declare const __APP_VERSION__: string;
/** Identifies one build (the version, or PLUMMET_BUILD_ID when the tests set it). */
declare const __BUILD_ID__: string;
/** True in development and tests; production builds drop the code behind it. */
declare const __DEV_CHECKS__: boolean;

// The import rules of the source tree, in one table: which folder may import which, only through a folder's
// index.ts, no circles, no packages in the pure core. `npm run guards` runs it; test/architecture.test.ts runs it
// under `npm test`, and test/architecture-escapes.test.ts proves that each rule fails on a planted escape.
// The layer map mirrors the contributor guide (DEVELOPERS.md, "The map"); change both together.

/** Which folders of src/ each folder may import (besides itself). A folder missing on disk simply matches nothing. */
const LAYERS = {
  errors: [],
  physics: ['errors'],
  log: ['errors'],
  analysis: ['physics', 'log', 'errors'],
  timing: ['physics', 'log', 'errors'],
  motion: ['physics', 'log', 'errors'],
  video: ['motion', 'errors'],
  charts: ['analysis', 'physics', 'log', 'errors'],
  report: ['charts', 'analysis', 'physics', 'log', 'errors'],
  store: ['log', 'errors'],
  sync: ['log', 'analysis', 'store', 'errors'],
  widgets: ['charts', 'timing', 'physics', 'log', 'errors'],
  ui: ['errors', 'physics', 'log', 'analysis', 'charts', 'report', 'timing', 'motion', 'video', 'store', 'sync', 'widgets'],
  cli: ['report', 'physics', 'log', 'analysis', 'errors'],
};

/** The service worker (sw/, outside src/) runs the office sync with no page open. */
const SERVICE_WORKER = ['sync', 'store', 'log', 'errors'];

/** Pure core: no platform, no clock, no randomness, no packages (tsconfig.core.json and check-pure-calls cover the rest). */
const PURE_CORE = [
  '^src/(physics|log|analysis|errors|charts|report|motion)/',
  '^src/timing/(tap-timing|onset-detector|sound-interval|sound-travel|timing-error)\\.ts$',
];

/**
 * Temporary exceptions, each with its reason; remove one as soon as the reason is gone.
 * - csv-export.ts builds physics requests inside sync/; it is moving to analysis/, after which sync/ no longer
 *   imports physics/ and cli/ no longer imports sync/.
 */
const folders = Object.keys(LAYERS);
const any = (names) => `^src/(${names.join('|')})/`;

const layerRules = folders.map((folder) => {
  const allowed = [folder, ...LAYERS[folder]];
  const pathNot = [any(allowed)];
  const fromPathNot = [];
  return {
    name: `layer-${folder}`,
    severity: 'error',
    comment: `${folder}/ may import only ${LAYERS[folder].length ? LAYERS[folder].map((f) => `${f}/`).join(', ') : 'nothing of ours'}`,
    from: { path: `^src/${folder}/`, pathNot: fromPathNot },
    // Anything of ours outside the allowed folders: another folder, a file at the top of src/, or sw/.
    to: { path: '^(src|sw)/', pathNot },
  };
});

module.exports = {
  forbidden: [
    ...layerRules,
    {
      name: 'layer-sw',
      severity: 'error',
      comment: `sw/ may import only ${SERVICE_WORKER.map((f) => `src/${f}/`).join(', ')}`,
      from: { path: '^sw/' },
      to: { path: '^src/', pathNot: [any(SERVICE_WORKER)] },
    },
    {
      name: 'layer-entry',
      severity: 'error',
      comment: 'the page entry (src/main.tsx) imports only ui/',
      from: { path: '^src/[^/]+$' },
      to: { path: '^(src|sw)/', pathNot: ['^src/ui/index\\.ts$', '^src/[^/]+$'] },
    },
    {
      name: 'folder-in-the-map',
      severity: 'error',
      comment: 'every folder of src/ has a place in the layer map (.dependency-cruiser.cjs LAYERS)',
      from: { path: '^src/[^/]+/', pathNot: [any(folders)] },
      to: {},
    },
    {
      name: 'only-through-index',
      severity: 'error',
      comment: "another folder is imported only through an index.ts (its own or a sub-folder's public face)",
      from: { path: '^(src/[^/]+|sw)/' },
      to: { path: '^src/[^/]+/', pathNot: ['^$1/', '/index\\.ts$'] },
    },
    {
      name: 'no-circular',
      severity: 'error',
      comment: 'no import circles, not even through types',
      from: {},
      to: { circular: true },
    },
    {
      name: 'pure-core-no-packages',
      severity: 'error',
      comment: 'the pure core imports no package and no Node module: only our own files',
      from: { path: PURE_CORE },
      to: { pathNot: '^src/' },
    },
    {
      name: 'pure-core-imports-pure-core',
      severity: 'error',
      comment: "the pure core imports only the pure core (the pure half of timing/ not timing's index nor audio-capture)",
      from: { path: PURE_CORE },
      to: { path: '^(src|sw)/', pathNot: PURE_CORE },
    },
    {
      name: 'resolvable',
      severity: 'error',
      comment: 'every import resolves (a typo in a path would otherwise slip past every other rule)',
      from: {},
      to: { couldNotResolve: true },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    // Type-only imports count: a layer is crossed by a type as much as by a value.
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: {
      exportsFields: ['exports'],
      conditionNames: ['import', 'require', 'node', 'default', 'types'],
      extensions: ['.ts', '.tsx', '.d.ts', '.js', '.mjs'],
    },
    moduleSystems: ['es6', 'cjs'],
    reporterOptions: { text: { highlightFocused: false } },
  },
};

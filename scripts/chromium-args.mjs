// Flags for the system Chromium on a machine with no GPU and no outside network: one list for the browser tests,
// the benchmarks, the size budget and Lighthouse (../shared/TOOLCHAIN.md has why each is there).
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

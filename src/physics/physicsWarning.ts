/** A result is still computed, but the user should know this about it. */
export interface PhysicsWarning {
  /** Stable code for screens and tests, e.g. "outside-cipm-range". */
  code: string;
  /** One plain sentence for people. */
  message: string;
  /**
   * How much it matters. "warning" (the default when absent): it may change whether the result can be trusted,
   * and the screens show it as a warning. "info": a routine note that changes nothing about the verdict (the
   * screens show it as information, never in a warning's look).
   */
  severity?: 'warning' | 'info';
}

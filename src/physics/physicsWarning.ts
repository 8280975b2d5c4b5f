/** A result is still computed, but the user should know this about it. */
export interface PhysicsWarning {
  /** Stable code for screens and tests, e.g. "outside-cipm-range". */
  code: string;
  /** One plain sentence for people. */
  message: string;
}

// Self-contained field widgets (Lit custom elements). Importing this module defines them.
export { QuantityInput, type QuantityChangeDetail } from './quantity-input';
export * from './units';

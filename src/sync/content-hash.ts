// The fingerprint lives in the pure core (log/content-hash.ts): the office folder's part index records it.
export { contentHash } from '../log';

/** The screens' message for people from any error the core, the store or the sync layer throws. */
export { describeError } from '../errors';

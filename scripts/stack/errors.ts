/** A failure of the stack scripts whose message alone tells a person what to do; shown without a stack trace. */
export class StackError extends Error {}

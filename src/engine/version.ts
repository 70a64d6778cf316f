/**
 * Version of the calculation engine, stored with every assessment snapshot so a
 * stored result can always be traced to the method that produced it. Bump the
 * minor part when a published check value or catalogue entry changes a result.
 */
export const ENGINE_VERSION = '1.0.0';

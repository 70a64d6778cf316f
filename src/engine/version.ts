/**
 * Version of the calculation engine, stored with every assessment snapshot so a
 * stored result can always be traced to the method that produced it. Bump the
 * minor part when a published check value or catalog entry changes a result, the major
 * part when the result's shape or its judgment changes (2.0.0: options per run, areas,
 * design air, service-decided billing, latent gain, fittings by size).
 */
export const ENGINE_VERSION = '2.0.0';

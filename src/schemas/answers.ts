/**
 * Every answer schema the estimate island parses, in one module, so the island's client
 * imports them with one request when the first answer arrives.
 */
export { apiErrorSchema } from './api-error';
export { submitAssessmentAnswerSchema } from './assessment-answer';
export { coverageAnswerSchema } from './coverage';
export { estimateAnswerSchema } from './estimate';

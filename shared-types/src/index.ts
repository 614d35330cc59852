/** Public door of the shared schemas and types. (spec-messages.ts is internal: not exported.) */
export * from './limits.js';
export * from './spec.js';
export * from './result.js';
export * from './spec-issue.js';
export * from './parse-spec.js';
export * from './canonical-spec.js';

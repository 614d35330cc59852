/** Public door of the API. */
export { buildApp, API_VERSION, type BuildAppHooks } from './app.js';
export { openApiDocument } from './openapi-document.js';
export { createApi, type Api, type CreateApiOptions } from './server.js';
export { API_DEFAULTS, type ApiContext, type ApiOptions } from './context.js';
export { ERRORS, BetasweepApiError, apiError, type ErrorCode, type ErrorIssue } from './errors.js';
export { loadSweepPlanner, type Planner, type PlannerParse } from './planner.js';
export { Metrics } from './metrics.js';

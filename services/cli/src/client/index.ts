/** Public door of the lab-machine client. */
export { ApiClient, ClientError } from './api-client.js';
export { resolveClientConfig, readClientConfigFile, writeClientConfigFile, clientConfigPath, DEFAULT_SERVER, type ClientConfig } from './client-config.js';
export { readSweepEvents, parseSseChunk, type SweepEvent, type ReadEventsOptions } from './read-events.js';
export { serverOptions, clientOptions, withClient, action, type ServerFlags, type ClientFlags } from './command-options.js';

export * from './api-client.js';
export * from './live-link.js';

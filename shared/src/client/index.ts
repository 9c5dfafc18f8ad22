export * from './api-client.js';

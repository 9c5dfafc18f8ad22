export * from './shop.js';
export * from './people.js';
export * from './work.js';
export * from './clock.js';
export * from './findings.js';
export * from './records.js';
export * from './pay.js';

export * from './floor-words.js';
export * from './timer-words.js';
export * from './punch-words.js';
export * from './finding-words.js';
export * from './connection-words.js';
export * from './office-words.js';
export * from './notice-words.js';
export * from './cut-at-word.js';

export * from './audit.js';
export * from './auth.js';
export * from './errors.js';
export * from './regions.js';
export * from './roles.js';
export * from './users.js';

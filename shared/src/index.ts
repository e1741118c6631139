export * from './audit.js';
export * from './auth.js';
export * from './errors.js';
export * from './intake.js';
export * from './radar.js';
export * from './regions.js';
export * from './roles.js';
export * from './users.js';

// Every table, one file per area. drizzle-kit reads this file to generate migrations.
export * from './accounts.js';
export * from './scenarios.js';
export * from './documents.js';
export * from './preferences.js';
export * from './lender.js';

// Every table, one file per area. drizzle-kit reads this file to generate migrations.
export * from './accounts.js';

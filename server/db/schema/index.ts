// Every table, one file per entity; drizzle-kit reads this file.
export * from './session';

// Every table, one file per entity; drizzle-kit reads this file.
export * from './dev-outbox';
export * from './password-resets';
export * from './session';
export * from './sign-in-failures';
export * from './studios';
export * from './users';
export * from './takes';
export * from './saved-drills';
export * from './custom-patterns';
export * from './player-settings';
export * from './tempo-climbs';
export * from './studio-invites';
export * from './assignments';
export * from './remarks';
export * from './notifications';
export * from './audit-log';
export * from './weekly-summaries';

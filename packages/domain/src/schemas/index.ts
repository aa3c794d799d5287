export * from './common.ts';
export * from './auth.ts';
export * from './users.ts';
export * from './sites.ts';
export * from './fields.ts';

export * from './errors';
export * from './auth';
export * from './studios';
export * from './drafts';
export * from './dev';

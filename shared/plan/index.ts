/** Planning arithmetic and loom-side lists: pure functions over a draft and the weaver's inputs. */
export * from './units';
export * from './yarn';
export * from './sett';
export * from './reed';
export * from './warp';
export * from './results';
export * from './loom-lists';
export * from './plan-schema';
export * from './compute-plan';
export * from './picks';
export * from './thread-sizes';

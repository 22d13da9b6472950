// Public API of the weave engine. Other modules add their own export lines here; edit, never overwrite.
export * from './types';
export * from './drawdown';
export * from './draft';
export * from './migrate';
export * from './cloth';
export * from './floats';
export * from './liftplan';
export * from './sequences';
export * from './wif';
export * from './profile';
export * from './layers';
export * from './check-threading';
export * from './colour-names';
export * from './checks';
export * from './words';
export * from './compare';
export * from './text';

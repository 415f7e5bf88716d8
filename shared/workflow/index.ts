export * from './revision-states';
export * from './relations';
export * from './signatures';
export * from './state-sets';
export * from './signing-blockers';

export * from './bundles';
export * from './cases';
export * from './replays';
export * from './server-secrets';
export * from './sessions';
export * from './users';

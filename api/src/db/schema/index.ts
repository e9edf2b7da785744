export * from './cases';
export * from './server-secrets';
export * from './sessions';
export * from './users';

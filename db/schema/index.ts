export * from './shops';
export * from './auth';

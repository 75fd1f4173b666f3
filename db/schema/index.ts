export * from './shops';
export * from './auth';
export * from './records';
export * from './settings';
export * from './review';
export * from './practice';
export * from './customer-record';

export * from './errors';
export * from './auth';
export * from './profile';

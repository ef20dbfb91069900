export * from './errors';
export * from './auth';
export * from './profile';
export * from './balls';
export * from './patterns';
export * from './matchups';
export * from './centers';

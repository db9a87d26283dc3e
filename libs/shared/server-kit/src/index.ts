export * from './errors';
export * from './error-handler';
export * from './endpoint';
export * from './openapi';
export * from './logger';

export * from './errors';
export * from './error-handler';
export * from './endpoint';
export * from './openapi';
export * from './logger';
export * from './request-context';
export * from './env';

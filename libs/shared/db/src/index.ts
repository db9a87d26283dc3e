export * from './database';
export * from './connect';
export * from './tenant-scope';
export * from './migrate';
export * from './audit';

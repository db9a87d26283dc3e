export * from './connection';
export * from './mail-queue';
export * from './mail-templates';
export * from './mailer';
export * from './reorder-queue';

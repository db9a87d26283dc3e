// Packages the fakes use that ship no TypeScript types (and have no @types package installed).
declare module 'oidc-provider';
declare module 's3rver';

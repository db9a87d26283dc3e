export * from './takeoff.endpoints';
export * from './takeoff.schemas';

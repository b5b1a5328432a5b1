export * from './types';
export * from './footprint';
export * from './sources';
export * from './sun';
export * from './check';
export * from './what-fits';

export * from './units';
export * from './rect';

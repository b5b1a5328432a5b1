export * from './units';
export * from './rect';
export * from './overlap-index';

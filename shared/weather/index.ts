export * from './units';
export * from './quantities';

export * from './types';
export * from './sources';
export * from './crops';
export * from './caution';
export * from './pests';
export * from './rotation';
export * from './relations';

export * from './spacing';
export * from './emergence';
export * from './dates';
export * from './harvest';
export * from './summary';

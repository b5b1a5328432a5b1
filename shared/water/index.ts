export * from './et0';
export * from './kc';
export * from './need';
export * from './units';

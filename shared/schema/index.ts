export * from './herd';
export * from './option';
export * from './finance';
export * from './risk';
export * from './scenario';

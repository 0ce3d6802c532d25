export * from './auth';
export * from './nursery';
export * from './catalogue';
export * from './stock';
export * from './plants';
export * from './plans';
export * from './board';

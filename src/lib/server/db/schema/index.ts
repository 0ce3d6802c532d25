export * from './auth';
export * from './nursery';

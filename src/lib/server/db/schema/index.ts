export * from './auth';
export * from './audit';
export * from './contractors';
export * from './leads';
export * from './mail';
export * from './plans';
export * from './idempotency';
export * from './rate';

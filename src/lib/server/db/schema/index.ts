export * from './auth';
export * from './contractors';
export * from './mail';
export * from './plans';

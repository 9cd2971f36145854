export * from './common';
export * from './auth';
export * from './kits';
export * from './designs';
export * from './builds';
export * from './travelers';
export * from './findings';
export * from './coupons';

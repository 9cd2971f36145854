export * from './organizations';
export * from './users';
export * from './designs';
export * from './builds';
export * from './travelers';
export * from './findings';
export * from './coupons';
export * from './studies';

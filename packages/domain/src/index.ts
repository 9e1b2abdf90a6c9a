export * from './errors/api-error.ts';
export * from './permissions/roles.ts';
export * from './permissions/ability.ts';
export * from './auth/auth-schemas.ts';
export * from './members/member-schemas.ts';
export * from './firms/firm-schemas.ts';
export * from './outbox/outbox-schemas.ts';

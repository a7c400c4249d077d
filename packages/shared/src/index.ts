export * from './roles.ts';
export * from './fields.ts';
export * from './ability.ts';
export * from './schemas/common.ts';
export * from './schemas/session.ts';
export * from './schemas/staff.ts';
export * from './schemas/admin.ts';

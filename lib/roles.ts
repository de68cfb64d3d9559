// The roles of an organization's members. Pure: validation, forms and the permission map read it
// (lib/auth/permissions.ts says what each role may do).
export const ROLES = ['manager', 'operator', 'pilot'] as const;
export type Role = (typeof ROLES)[number];

import { z } from 'zod';

export const roles = ['owner', 'admin', 'stores', 'engineer'] as const;
export const roleSchema = z.enum(roles, {
  error: () => ({ message: `Role must be one of: ${roles.join(', ')}.` }),
});
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  admin: 'Admin',
  stores: 'Stores',
  engineer: 'Engineer',
};

export const roleSummaries: Record<Role, string> = {
  owner: 'Everything, including changing owners; watches stock and kit per van.',
  admin: 'Manages members and their roles, firm settings and reminder settings.',
  stores: 'Products, stock receipts, transfers to vans, stocktakes, kits and inspections.',
  engineer: 'Sees their own van, checks kits out and in, records jobs.',
};

import { z } from 'zod';

export const ROLES = ['admin', 'engineer', 'sourcing', 'lead', 'viewer'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  engineer: 'Engineer',
  sourcing: 'Sourcing',
  lead: 'Lead',
  viewer: 'Viewer',
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'Everything, plus users, invitations, rates import, audit log and backups.',
  engineer: 'Creates and edits devices, teardowns, photos, parts, measurements, bench runs and findings; submits for review.',
  sourcing: 'Reads everything; edits prices, price breaks, currencies and cost models.',
  lead: 'Reads everything; comments; approves or sends back teardowns; builds lineups.',
  viewer: 'Reads published teardowns and lineups only.',
};

import type { Role } from '@splitcase/contracts';
import type { LucideIcon } from 'lucide-react';
import { Boxes, House, ShieldCheck } from 'lucide-react';
import { paths } from './paths';

export interface NavItem {
  label: string;
  to: string;
  icon: LucideIcon;
  roles: readonly Role[] | 'all';
  /** Match nested URLs too. */
  prefix?: string;
}

const ALL = 'all' as const;

/** The left rail. Each page that is added appears here with the roles that may open it. */
export const NAV: NavItem[] = [
  { label: 'Home', to: paths.home(), icon: House, roles: ALL },
  { label: 'Admin', to: paths.admin.users(), icon: ShieldCheck, roles: ['admin'], prefix: '/admin' },
  { label: 'Devices', to: paths.devices(), icon: Boxes, roles: ALL, prefix: '/devices' },
];

export const navFor = (role: Role) => NAV.filter((n) => n.roles === 'all' || n.roles.includes(role));

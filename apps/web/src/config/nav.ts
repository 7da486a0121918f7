import type { Role } from '@splitcase/contracts';
import type { LucideIcon } from 'lucide-react';
import { Activity, Boxes, ChartScatter, Coins, House, ScanSearch, ShieldCheck, Wrench } from 'lucide-react';
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

/** The left rail, in order. Each page that is added appears here with the roles that may open it. */
export const NAV: NavItem[] = [
  { label: 'Home', to: paths.home(), icon: House, roles: ALL },
  { label: 'Devices', to: paths.devices(), icon: Boxes, roles: ALL, prefix: '/devices' },
  { label: 'Findings', to: paths.findings(), icon: ScanSearch, roles: ALL, prefix: '/findings' },
  { label: 'Lineups', to: paths.lineups(), icon: ChartScatter, roles: ALL, prefix: '/lineups' },
  { label: 'Bench tools', to: paths.tools(), icon: Wrench, roles: ALL, prefix: '/tools' },
  { label: 'Bench runs', to: paths.benchRuns(), icon: Activity, roles: ALL, prefix: '/bench/runs' },
  { label: 'Rates & cost model', to: paths.rates(), icon: Coins, roles: ['admin', 'sourcing'] },
  { label: 'Admin', to: paths.admin.users(), icon: ShieldCheck, roles: ['admin'], prefix: '/admin' },
];

export const navFor = (role: Role) => NAV.filter((n) => n.roles === 'all' || n.roles.includes(role));

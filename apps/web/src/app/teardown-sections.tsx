// The sections of the teardown workspace: this is where the features meet. Each entry names the
// section, its icon, the component (lazy) and whether the figures panel stays beside it.
import { lazy, type ComponentType, type LazyExoticComponent } from 'react';
import type { LucideIcon } from 'lucide-react';
import { FileText } from 'lucide-react';
import { Activity } from 'lucide-react';
import type { TeardownDto } from '@splitcase/contracts';
import type { TeardownSection } from '@/config/paths';

export interface SectionProps {
  teardown: TeardownDto;
}

export interface SectionDef {
  id: TeardownSection;
  label: string;
  icon: LucideIcon;
  Component: LazyExoticComponent<ComponentType<SectionProps>> | ComponentType<SectionProps>;
  /** Keep the figures panel beside this section (each entry's effect seen at once). */
  withFigures: boolean;
}

export const SECTIONS: SectionDef[] = [
  {
    id: 'overview',
    label: 'Overview',
    icon: FileText,
    Component: lazy(() => import('@/features/teardowns/components/overview-section').then((m) => ({ default: m.OverviewSection }))),
    withFigures: true,
  },
  {
    id: 'runs',
    label: 'Bench runs',
    icon: Activity,
    Component: lazy(() => import('@/features/runs/components/runs-section').then((m) => ({ default: m.RunsSection }))),
    withFigures: true,
  },
];

// The sections of the teardown workspace: this is where the features meet. Each entry names the
// section, its icon, the component (lazy) and whether the figures panel stays beside it.
import { lazy, type ComponentType, type LazyExoticComponent } from 'react';
import type { LucideIcon } from 'lucide-react';
import { FileText } from 'lucide-react';
import { Camera } from 'lucide-react';
import { Gauge, ListTree, Zap } from 'lucide-react';
import { Calculator } from 'lucide-react';
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
    id: 'photos',
    label: 'Photos',
    icon: Camera,
    Component: lazy(() => import('@/features/photos/components/photos-section').then((m) => ({ default: m.PhotosSection }))),
    withFigures: false,
  },
  {
    id: 'parts',
    label: 'Parts',
    icon: ListTree,
    Component: lazy(() => import('@/features/parts/components/parts-section').then((m) => ({ default: m.PartsSection }))),
    withFigures: true,
  },
  {
    id: 'power',
    label: 'Power system',
    icon: Zap,
    Component: lazy(() => import('@/features/power/components/power-section').then((m) => ({ default: m.PowerSection }))),
    withFigures: true,
  },
  {
    id: 'measurements',
    label: 'Measurements',
    icon: Gauge,
    Component: lazy(() => import('@/features/measurements/components/measurements-section').then((m) => ({ default: m.MeasurementsSection }))),
    withFigures: true,
  },
  {
    id: 'runs',
    label: 'Bench runs',
    icon: Activity,
    Component: lazy(() => import('@/features/runs/components/runs-section').then((m) => ({ default: m.RunsSection }))),
    withFigures: true,
  },
  {
    id: 'cost',
    label: 'Cost',
    icon: Calculator,
    Component: lazy(() => import('@/features/cost/components/cost-section').then((m) => ({ default: m.CostSection }))),
    withFigures: false,
  },
];

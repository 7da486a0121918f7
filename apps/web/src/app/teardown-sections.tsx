// The sections of the teardown workspace: this is where the features meet. Each entry names the
// section, its icon, the component (lazy) and whether the figures panel stays beside it.
import { lazy, type ComponentType, type LazyExoticComponent } from 'react';
import type { LucideIcon } from 'lucide-react';
import { Activity, Calculator, Camera, FileText, Gauge, History, Lightbulb, ListTree, MessageSquare, Zap } from 'lucide-react';
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

// Parts and findings show the photo pins that point at them (the photos feature's PinsFor).
const PartsWithPins = lazy(async () => {
  const [{ PartsSection }, { PinsFor }] = await Promise.all([import('@/features/parts/components/parts-section'), import('@/features/photos/components/pins-for')]);
  return {
    default: ({ teardown }: SectionProps) => <PartsSection teardown={teardown} renderPartExtras={(partId) => <PinsFor teardownId={teardown.id} partId={partId} />} />,
  };
});

const FindingsWithPins = lazy(async () => {
  const [{ FindingsSection }, { PinsFor }] = await Promise.all([import('@/features/findings/components/findings-section'), import('@/features/photos/components/pins-for')]);
  return {
    default: ({ teardown }: SectionProps) => <FindingsSection teardown={teardown} renderFindingExtras={(findingId) => <PinsFor teardownId={teardown.id} findingId={findingId} />} />,
  };
});

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
  { id: 'parts', label: 'Parts', icon: ListTree, Component: PartsWithPins, withFigures: true },
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
  { id: 'findings', label: 'Findings', icon: Lightbulb, Component: FindingsWithPins, withFigures: true },
  {
    id: 'cost',
    label: 'Cost',
    icon: Calculator,
    Component: lazy(() => import('@/features/cost/components/cost-section').then((m) => ({ default: m.CostSection }))),
    withFigures: false,
  },
  {
    id: 'comments',
    label: 'Comments',
    icon: MessageSquare,
    Component: lazy(() => import('@/features/teardowns/components/comments-section').then((m) => ({ default: m.CommentsSection }))),
    withFigures: false,
  },
  {
    id: 'history',
    label: 'History',
    icon: History,
    Component: lazy(() => import('@/features/teardowns/components/history-section').then((m) => ({ default: m.HistorySection }))),
    withFigures: false,
  },
];

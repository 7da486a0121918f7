// The sections of the teardown workspace: this is where the features meet. Each entry names the
// section, its icon, the component (lazy) and whether the figures panel stays beside it.
import { lazy, type ComponentType, type LazyExoticComponent } from 'react';
import type { LucideIcon } from 'lucide-react';
import { FileText, History, Lightbulb, MessageSquare } from 'lucide-react';
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
    id: 'findings',
    label: 'Findings',
    icon: Lightbulb,
    Component: lazy(() => import('@/features/findings/components/findings-section').then((m) => ({ default: m.FindingsSection }))),
    withFigures: true,
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

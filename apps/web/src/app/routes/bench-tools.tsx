import { useRef, type KeyboardEvent } from 'react';
import { useSearchParams } from 'react-router';
import { Battery, Flame, ScanText } from 'lucide-react';
import { PageHeader } from '@/components/page';
import { WidgetBoundary } from '@/components/error-boundary';
import { TOOL_TABS, type ToolTab } from '@/config/paths';
import { HeaterTracePanel } from '@/features/tools/components/heater-trace-panel';
import { MarkingPanel } from '@/features/tools/components/marking-panel';
import { RuntimePanel } from '@/features/tools/components/runtime-panel';

const TABS: Record<ToolTab, { label: string; icon: typeof Flame; Panel: () => React.JSX.Element }> = {
  marking: { label: 'Marking decoder', icon: ScanText, Panel: MarkingPanel },
  'heater-trace': { label: 'Heater trace', icon: Flame, Panel: HeaterTracePanel },
  runtime: { label: 'Runtime', icon: Battery, Panel: RuntimePanel },
};

/** Bench tools: marking decoder, heater-trace and runtime calculators, without opening a teardown. */
export function Component() {
  const [params, setParams] = useSearchParams();
  const requested = params.get('tool');
  const active: ToolTab = (TOOL_TABS as readonly string[]).includes(requested ?? '') ? (requested as ToolTab) : 'marking';
  const refs = useRef<Partial<Record<ToolTab, HTMLButtonElement | null>>>({});
  const select = (tab: ToolTab, focus = false) => {
    setParams(tab === 'marking' ? {} : { tool: tab }, { replace: true });
    if (focus) refs.current[tab]?.focus();
  };
  const onKey = (e: KeyboardEvent) => {
    const i = TOOL_TABS.indexOf(active);
    const next = e.key === 'ArrowRight' ? i + 1 : e.key === 'ArrowLeft' ? i - 1 : e.key === 'Home' ? 0 : e.key === 'End' ? TOOL_TABS.length - 1 : null;
    if (next === null) return;
    e.preventDefault();
    select(TOOL_TABS[(next + TOOL_TABS.length) % TOOL_TABS.length]!, true);
  };
  const { Panel } = TABS[active];
  return (
    <div>
      <PageHeader
        title="Bench tools"
        subtitle="Decode part markings and work out heater traces and runtimes without opening a teardown. Type values with their units as you would write them; the server does the arithmetic and shows how. Figures are engineering estimates, not certification results."
      />
      <div role="tablist" aria-label="Bench tools" className="mb-6 flex gap-1 border-b border-graphite-150" onKeyDown={onKey}>
        {TOOL_TABS.map((tab) => {
          const { label, icon: Icon } = TABS[tab];
          const selected = tab === active;
          return (
            <button
              key={tab}
              ref={(el) => {
                refs.current[tab] = el;
              }}
              type="button"
              role="tab"
              id={`tab-${tab}`}
              aria-selected={selected}
              aria-controls={`panel-${tab}`}
              tabIndex={selected ? 0 : -1}
              onClick={() => select(tab)}
              className={`-mb-px flex h-11 items-center gap-2 border-b-2 px-4 text-sm font-medium ${selected ? 'border-copper-500 text-graphite-950' : 'border-transparent text-graphite-500 hover:text-graphite-800'}`}
            >
              <Icon className="size-4" aria-hidden />
              {label}
            </button>
          );
        })}
      </div>
      <div role="tabpanel" id={`panel-${active}`} aria-labelledby={`tab-${active}`}>
        <WidgetBoundary name={active} key={active}>
          <Panel />
        </WidgetBoundary>
      </div>
    </div>
  );
}

import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { RatesPanel } from '@/features/cost/components/rates-panel';
import { SalesTaxPanel } from '@/features/cost/components/sales-tax-panel';
import { WorkspaceModelPanel } from '@/features/cost/components/workspace-model-panel';

/** Rates & cost model (sourcing and admin): currency rates with their date and source, sales tax by currency, and the cost-model defaults. */
export function Component() {
  return (
    <RequireRole roles={['admin', 'sourcing']}>
      <PageHeader
        eyebrow="Should-cost"
        title="Rates & cost model"
        subtitle="Currency rates convert every price to the reporting currency; the cost model turns a priced BOM into ex-works and landed cost. Both apply to every teardown."
      />
      <div className="grid gap-6 2xl:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <div className="space-y-6">
          <RatesPanel />
          <SalesTaxPanel />
        </div>
        <WorkspaceModelPanel />
      </div>
    </RequireRole>
  );
}

// The derived figures and suggested findings of a teardown: a thin orchestrator over one module per
// subsystem (pack, loads and modes, heaters, charge and output, capacity, traces, claims, suggestions).
import { capacityFigures } from './capacity';
import { chargeFigures, powerBankFigures } from './charge-and-output';
import { claimFigures } from './claims';
import { readContext } from './context';
import { loadFigures, readLoads } from './loads';
import { modeAndLoadFigures } from './modes';
import { packFigures } from './pack';
import { suggestionRules } from './suggestions';
import { traceFigures } from './traces';
import type { TeardownFigureInput, TeardownFiguresResult } from './types';

export * from './types';
export { labelClaimCheck, type LabelClaimCheck } from './pack';
export { ALL_AT_ONCE_NOTE } from './modes';

/** Derived figures and suggested findings of a teardown, computed from its stored records. */
export function teardownFigures(input: TeardownFigureInput): TeardownFiguresResult {
  const ctx = readContext(input);
  packFigures(ctx);
  const loads = readLoads(ctx);
  loadFigures(ctx, loads);
  const modes = modeAndLoadFigures(ctx, loads);
  powerBankFigures(ctx, loads);
  chargeFigures(ctx, loads);
  const capacity = capacityFigures(ctx);
  claimFigures(ctx, loads, modes);
  const overRated = traceFigures(ctx);
  suggestionRules(ctx, modes, capacity, overRated);
  return { figures: ctx.figures, suggestions: ctx.suggestions };
}

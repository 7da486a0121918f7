// The device's claimed output set against the computed one.
import { figure, inp, num } from './build';
import type { FigureContext } from './context';
import type { ModesOutcome } from './modes';
import { FIGURE_DEFAULTS } from './types';
import type { LoadSet } from './loads';

/** Claimed output power against the highest computed: the largest mode's power at the loads, else the full-duty total of the loads. */
export function claimFigures(ctx: FigureContext, loads: LoadSet, modes: ModesOutcome): void {
  const claimed = ctx.claims.outputWatts;
  if (claimed === undefined || loads.computed.length === 0) return;
  const computed = modes.recorded ? Math.max(...modes.results.map((r) => r.loadWatts)) : loads.computed.reduce((s, l) => s + l.r.totalWatts, 0);
  if (!(computed > 0)) return;
  const share = computed / claimed;
  const tol = FIGURE_DEFAULTS.claimTolerance;
  const top = modes.recorded ? modes.results.reduce((a, b) => (b.loadWatts > a.loadWatts ? b : a)) : undefined;
  ctx.figures.push(
    figure({
      key: 'claim.outputWatts',
      label: 'Computed output against the claimed',
      value: share * 100,
      unit: '%',
      family: 'claim.outputWatts',
      inputs: [inp('claimedWatts', 'Claimed output', claimed, 'W'), inp('computedWatts', top ? `Power at the loads in mode "${top.run.name}"` : 'Power of all loads at full duty', computed, 'W')],
      assumptions: [top ? 'The mode with the most power at the loads.' : 'No modes recorded: every load at full duty.', `Within ±${tol * 100} % counts as met [CP].`],
      warnings:
        share < 1 - tol
          ? [`The computed ${num(computed)} W is ${num((1 - share) * 100)} % below the claimed ${num(claimed)} W.`]
          : share > 1 + tol
            ? [`The computed ${num(computed)} W is ${num((share - 1) * 100)} % above the claimed ${num(claimed)} W: check the records or the claim.`]
            : [],
    }),
  );
}

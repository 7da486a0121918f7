// The device's claimed output and power set against the computed ones.
import { figure, inp, num } from './build';
import type { FigureContext } from './context';
import type { LoadInfo, LoadSet } from './loads';
import type { ModesOutcome } from './modes';
import { FIGURE_DEFAULTS } from './types';

const isUsb = (l: LoadInfo) => l.load.kind === 'usb-output';

/** The highest power of some loads: over the recorded modes at their duty, else every such load at full duty. */
function highest(loads: LoadSet, modes: ModesOutcome, pick: (l: LoadInfo) => boolean): { watts: number; basis: string } {
  if (modes.recorded) {
    let best = { watts: 0, basis: '' };
    for (const r of modes.results) {
      const w = r.run.entries.filter((e) => pick(e.info)).reduce((s, e) => s + e.duty * e.info.r.totalWatts, 0);
      if (w > best.watts) best = { watts: w, basis: `mode "${r.run.name}"` };
    }
    return best;
  }
  return { watts: loads.computed.filter(pick).reduce((s, l) => s + l.r.totalWatts, 0), basis: 'every such load at full duty (no modes recorded)' };
}

/**
 * Claimed output power (a USB output's, when the device has one; else the largest mode's power) and
 * claimed power (the heat or light side: loads other than USB outputs) against the computed ones.
 */
export function claimFigures(ctx: FigureContext, loads: LoadSet, modes: ModesOutcome): void {
  const tol = FIGURE_DEFAULTS.claimTolerance;
  const emit = (key: string, label: string, claimed: number, computed: { watts: number; basis: string }, what: string) => {
    if (!(computed.watts > 0)) return;
    const share = computed.watts / claimed;
    ctx.figures.push(
      figure({
        key,
        label,
        value: share * 100,
        unit: '%',
        family: 'claim.outputWatts',
        inputs: [inp('claimedWatts', 'Claimed', claimed, 'W'), inp('computedWatts', `Computed: ${what}, ${computed.basis}`, computed.watts, 'W')],
        assumptions: [`Within ±${tol * 100} % counts as met [CP].`],
        warnings:
          share < 1 - tol
            ? [`The computed ${num(computed.watts)} W is ${num((1 - share) * 100)} % below the claimed ${num(claimed)} W.`]
            : share > 1 + tol
              ? [`The computed ${num(computed.watts)} W is ${num((share - 1) * 100)} % above the claimed ${num(claimed)} W: check the records or the claim.`]
              : [],
      }),
    );
  };
  const { outputWatts, powerWatts } = ctx.claims;
  if (outputWatts !== undefined) {
    const hasUsb = loads.computed.some(isUsb);
    emit('claim.outputWatts', 'Computed output against the claimed', outputWatts, hasUsb ? highest(loads, modes, isUsb) : highest(loads, modes, () => true), hasUsb ? 'the USB output' : 'the loads');
  }
  if (powerWatts !== undefined)
    emit(
      'claim.powerWatts',
      'Computed power against the claimed',
      powerWatts,
      highest(loads, modes, (l) => !isUsb(l)),
      'the loads other than USB outputs',
    );
}

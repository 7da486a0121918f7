import type { EntityManager } from '@mikro-orm/sqlite';
import type { TeardownFigureInput } from '@splitcase/calc';
import type { Teardown } from '../teardowns/teardown.entity';
import { findInChunks, refId } from '../../db/batch';
import { PackSchema } from '../power/pack.entity';
import { BenchRunSchema, type BenchRun } from './bench-run.entity';

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
const fmt = (x: number, digits = 3) => Number(x.toPrecision(digits)).toString();

/**
 * Feeds the teardown figures with what the bench measured, for any number of teardowns in a fixed
 * number of queries (the runs, the packs):
 * - the latest discharge run: the capacity delivered at the pack terminals (measuredCapacityAh, which
 *   calc turns into capacity.measuredVsLabel and the capacity suggestion) and, in measuredDischarge,
 *   its energy, mean V² and duration;
 * - the latest discharge run with a current pulse: the DC resistance it gave, per cell
 *   (cellInternalResistance): the pack-terminal value × cells in parallel ÷ cells in series, from the
 *   pack record (one cell when there is none);
 * - the latest power-bank run: its conversion efficiency and the energy at the output (powerBankRun);
 * - the peak surface temperature of the latest thermal run, which the touch margin uses instead of the
 *   estimate (the same peak the run's own burn-threshold margin uses).
 */
export async function benchRunFigureInputs(em: EntityManager, teardowns: Teardown[]): Promise<Map<number, Partial<TeardownFigureInput>>> {
  const ids = teardowns.map((t) => t.id);
  const runs = await findInChunks(ids, (chunk) =>
    em.find(
      BenchRunSchema,
      { teardown: { $in: chunk }, kind: { $in: ['discharge', 'thermal', 'power-bank'] } },
      { fields: ['teardown', 'kind', 'label', 'analysis', 'createdAt'] as never, orderBy: { createdAt: 'desc', id: 'desc' } },
    ),
  );
  const withPulse = runs.some((r) => r.kind === 'discharge' && r.analysis.discharge?.internalResistance);
  const packs = withPulse ? await findInChunks(ids, (chunk) => em.find(PackSchema, { teardown: { $in: chunk } }, { fields: ['teardown', 'series', 'parallel'] as never })) : [];
  const packOf = new Map(packs.map((p) => [refId(p.teardown), p]));
  // Newest first: the first run of a kind seen for a teardown is its latest.
  const latest = new Map<string, BenchRun>();
  for (const r of runs) {
    const key = `${refId(r.teardown)}:${r.kind}`;
    if (!latest.has(key)) latest.set(key, r);
    const pulseKey = `${refId(r.teardown)}:pulse`;
    if (r.kind === 'discharge' && r.analysis.discharge?.internalResistance && !latest.has(pulseKey)) latest.set(pulseKey, r);
  }
  const out = new Map<number, Partial<TeardownFigureInput>>();
  for (const t of teardowns) {
    const discharge = latest.get(`${t.id}:discharge`);
    const thermal = latest.get(`${t.id}:thermal`);
    const bank = latest.get(`${t.id}:power-bank`);
    const pulseRun = latest.get(`${t.id}:pulse`);
    const add: Partial<TeardownFigureInput> = {};
    const a = discharge?.analysis;
    if (discharge && a && finite(a.ampHours)) {
      add.measuredCapacityAh = a.ampHours;
      add.measuredDischarge = { ampHours: a.ampHours, basis: `discharge run "${discharge.label}"` };
      if (finite(a.wattHours)) add.measuredDischarge.wattHours = a.wattHours;
      if (finite(a.discharge?.meanSquareVolts)) add.measuredDischarge.meanSquareVolts = a.discharge.meanSquareVolts;
      if (finite(a.durationS)) add.measuredDischarge.durationSeconds = a.durationS;
    }
    const pulse = pulseRun?.analysis.discharge?.internalResistance;
    if (pulseRun && pulse && finite(pulse.ohms)) {
      const pack = packOf.get(t.id);
      const series = pack?.series ?? 1;
      const parallel = pack?.parallel ?? 1;
      const measured = `${fmt(pulse.ohms * 1000)} mΩ at the pack terminals from the current step ${fmt(pulse.lowAmps)} A → ${fmt(pulse.highAmps)} A in the discharge run "${pulseRun.label}"`;
      const perCell = !pack
        ? ', taken as one cell (no pack record); wiring and protection included'
        : series === 1 && parallel === 1
          ? ' (one cell; wiring and protection included)'
          : `, × ${parallel} in parallel ÷ ${series} in series for one cell (wiring and protection included, so an upper bound)`;
      add.cellInternalResistance = { ohms: (pulse.ohms * parallel) / series, basis: `${measured}${perCell}` };
    }
    const pb = bank?.analysis;
    if (bank && pb?.powerBank && finite(pb.powerBank.efficiency) && finite(pb.wattHours)) {
      add.powerBankRun = {
        efficiency: pb.powerBank.efficiency,
        deliveredWh: pb.wattHours,
        basis: `power-bank run "${bank.label}" (cell energy from the ${pb.powerBank.cellEnergySource})`,
      };
      if (finite(pb.averageVolts)) add.powerBankRun.outputVolts = pb.averageVolts;
    }
    const peak = thermal?.analysis.thermal?.maxC;
    if (thermal && finite(peak)) add.measuredSurface = { temperatureC: peak, basis: `peak of the thermal run "${thermal.label}"` };
    out.set(t.id, add);
  }
  return out;
}

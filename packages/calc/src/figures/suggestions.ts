// Rules that turn the figures into proposed findings, in a fixed order.
import { AIR_TRANSPORT_CLASS_TEXT, AIR_TRANSPORT_CLASS_TEXT_INSTALLED, airTransportClass, isLithiumChemistry } from '../battery/index';
import { num } from './build';
import type { CapacityOutcome } from './capacity';
import type { FigureContext } from './context';
import type { ModesOutcome } from './modes';
import { claimAgainstMass, shipsAlone } from './pack';
import type { OverRatedTrace } from './traces';
import { HOT_SURFACE_CAUTION } from './types';

const SENSOR_CATEGORY = /sensor|thermistor|ntc|thermocouple/i;

export function suggestionRules(ctx: FigureContext, modes: ModesOutcome, capacity: CapacityOutcome, overRated: OverRatedTrace[]): void {
  const { pack, suggestions } = ctx;
  const loads = ctx.input.loads ?? [];
  const categories = ctx.input.partCategories ?? [];
  const heaterLoads = loads.filter((l) => l.kind === 'heater');
  const hasSensor = categories.some((c) => typeof c === 'string' && SENSOR_CATEGORY.test(c));
  if (heaterLoads.length > 0 && !hasSensor) {
    suggestions.push({
      key: 'thermal.no-sensor',
      title: 'Heater without temperature sensing',
      kind: 'safety',
      severity: 'major',
      detail:
        `The device drives ${heaterLoads.map((l) => `"${l.label}"`).join(', ')} but no part is recorded as a sensor. ` +
        'PWM regulation without feedback sets only the average power, not the temperature: nothing limits the surface ' +
        'temperature when the device is covered, pressed against skin or left in a pocket. A thermistor on the heated ' +
        'surface read by the controller, and a thermal cut-off, would bound it.',
    });
  }
  const burning = modes.recorded
    ? modes.results.filter((r) => r.heater && r.heater.margin < 0).map((r) => ({ h: r.heater!, mode: r.run.name }))
    : modes.heaters.filter((h) => h.margin < 0).map((h) => ({ h, mode: undefined }));
  if (burning.length > 0) {
    suggestions.push({
      key: 'thermal.touch-margin',
      title: 'Surface can pass the burn threshold',
      kind: 'safety',
      severity: hasSensor ? 'major' : 'critical',
      detail:
        burning
          .map(
            ({ h, mode }) =>
              `"${h.info.load.label}"${mode ? ` in mode "${mode}"` : ''}: ${h.measured ? `measured ${num(h.surface)} °C (${h.measured.basis})` : `estimated ${num(h.surface)} °C`} against ${h.threshold.thresholdC} °C for ${ctx.contact.text} contact with ${h.material} (margin ${num(h.margin, 2)} °C).`,
          )
          .join(' ') +
        ' ' +
        HOT_SURFACE_CAUTION,
    });
  }
  if (pack && isLithiumChemistry(pack.p.chemistry) && !pack.p.protection) {
    suggestions.push({
      key: 'pack.no-protection',
      title: 'Lithium pack without protection',
      kind: 'safety',
      severity: 'major',
      detail:
        `No protection circuit is recorded for the ${pack.p.chemistry} pack. Without over-charge, over-discharge, over-current ` +
        'and short-circuit protection a single fault can drive a cell into thermal runaway. Check whether the charger IC ' +
        'covers these functions; otherwise a protection IC with its switches, or protected cells, are needed.',
    });
  }
  if (pack && isLithiumChemistry(pack.p.chemistry) && pack.energyWh > 100) {
    const cls = airTransportClass(pack.energyWh);
    const text = (shipsAlone(ctx.input.deviceCategory) ? AIR_TRANSPORT_CLASS_TEXT : AIR_TRANSPORT_CLASS_TEXT_INSTALLED)[cls];
    suggestions.push({
      key: 'pack.over-100wh',
      title: 'Pack over 100 Wh',
      kind: 'compliance',
      severity: cls === 'over-160-wh' ? 'major' : 'minor',
      detail: `The pack is rated ${num(pack.energyWh)} Wh. ${text} Shipping and labelling rules for this class apply; the current regulations and the carrier's rules govern.`,
    });
  }
  const reasons: string[] = [];
  const check = pack ? claimAgainstMass(pack, ctx.claims) : undefined;
  if (pack && check && !check.plausibility.plausible) {
    const pl = check.plausibility;
    reasons.push(
      `The capacity on ${check.basis === 'label' ? 'the device label' : 'the cell rating'} (${num(pl.claimedWh)} Wh) in a ${num((pack.p.packMassKg as number) * 1000)} g pack ` +
        `would be ${num(pl.specificEnergyWhPerKg)} Wh/kg, beyond the ${pl.limitWhPerKg} Wh/kg that ${pack.p.chemistry} cells reach.`,
    );
  }
  if (capacity.ratio !== undefined && capacity.ratio < ctx.warnFraction) {
    reasons.push(`The measured capacity is ${num(capacity.ratio * 100)} % of the label (${capacity.labelBasis}), below the ${num(ctx.warnFraction * 100)} % warning level.`);
  }
  if (reasons.length > 0) {
    suggestions.push({
      key: 'capacity.implausible',
      title: 'Label capacity not supported',
      kind: 'compliance',
      severity: 'major',
      detail: `${reasons.join(' ')} Rated capacity must be delivered at 0.2 C and 20 ± 5 °C (IEC 61960-3).`,
    });
  }
  if (overRated.length > 0) {
    suggestions.push({
      key: 'trace.over-rating',
      title: 'Trace above its IPC-2221 rating',
      kind: 'reliability',
      severity: 'major',
      detail:
        overRated.map(({ t, rating, rise }) => `"${t.label}" carries ${num(t.currentA)} A against ${num(rating)} A for a ${num(rise)} °C rise.`).join(' ') +
        ' Widen the copper, use heavier copper, or accept and verify a larger temperature rise.',
    });
  }
}

// Whole-device figures of the pack: rated energy, air-transport class, how it ships, specific energy.
import {
  AIR_TRANSPORT_CLASS_TEXT,
  AIR_TRANSPORT_CLASS_TEXT_INSTALLED,
  SPECIFIC_ENERGY_LIMITS,
  airTransportClass,
  isLithiumChemistry,
  labelCapacityPlausibility,
  lithiumIonShipping,
  specificEnergyWhPerKg,
  type ShippingArrangement,
} from '../battery/index';
import { figure, inp, num } from './build';
import { readPack, type FigureContext, type PackInfo } from './context';
import type { TeardownFigureInput } from './types';

/** Power banks are spare batteries to the rules; everything else carries its battery installed [S: IATA DGR; M for the power-bank rule]. */
export const shipsAlone = (category: string | undefined) => category === 'power-bank';

const SHIPPING_CAUTION = "The current edition of the IATA Dangerous Goods Regulations and the carrier's own rules govern; this is an engineering aid, not a shipping declaration.";

export function packFigures(ctx: FigureContext): void {
  const { pack } = ctx;
  if (!pack) return;
  const { p } = pack;
  ctx.figures.push(
    figure({
      key: 'pack.energy',
      label: 'Pack energy',
      value: pack.energyWh,
      unit: 'Wh',
      family: 'pack.energy',
      inputs: [
        inp('cellNominalVolts', 'Cell nominal voltage', p.cellNominalVolts, 'V'),
        inp('cellRatedAh', 'Cell rated capacity', p.cellRatedAh, 'Ah'),
        inp('series', 'Cells in series', p.series),
        inp('parallel', 'Cells in parallel', p.parallel),
      ],
      assumptions: ['Rated (label) capacity at nominal voltage.'],
    }),
  );
  if (isLithiumChemistry(p.chemistry)) {
    const cls = airTransportClass(pack.energyWh);
    const alone = shipsAlone(ctx.input.deviceCategory);
    ctx.figures.push(
      figure({
        key: 'pack.transportClass',
        label: 'Air-transport class',
        value: cls,
        unit: '',
        family: 'pack.transportClass',
        inputs: [inp('packWh', 'Pack energy', pack.energyWh, 'Wh'), inp('carried', 'Carried as', alone ? 'spare battery (power bank)' : 'installed in the equipment')],
        assumptions: ['Watt-hour rating from the rated capacity at nominal voltage, as the regulations use it.'],
        warnings: [
          (alone ? AIR_TRANSPORT_CLASS_TEXT : AIR_TRANSPORT_CLASS_TEXT_INSTALLED)[cls],
          'The battery type must pass UN Manual of Tests and Criteria 38.3 (T.1–T.8), with a test summary available.',
        ],
      }),
    );
    const arrangement: ShippingArrangement = alone ? 'alone' : 'contained-in';
    const cellWh = p.cellNominalVolts * p.cellRatedAh;
    const ship = lithiumIonShipping({ cellWh, batteryWh: pack.energyWh, arrangement });
    ctx.figures.push(
      figure({
        key: 'pack.shipping',
        label: 'Shipping as cargo by air',
        value: `${ship.unNumber}, ${ship.packingInstruction}${ship.sectionII ? ', Section II' : ''}`,
        unit: '',
        family: 'pack.shipping',
        inputs: [
          inp('cellWh', 'Energy per cell', cellWh, 'Wh'),
          inp('batteryWh', 'Energy of the battery', pack.energyWh, 'Wh'),
          inp('arrangement', 'Ships', alone ? 'as batteries alone (a power bank)' : 'contained in equipment'),
          inp('stateOfChargeLimit', 'Highest state of charge', ship.stateOfChargeLimit === null ? 'no limit set' : `${ship.stateOfChargeLimit * 100} %`),
        ],
        assumptions: [...ship.rules, ...(alone ? ['Power banks ship as batteries, not as equipment [M].'] : ['Packed with the equipment instead, the battery ships as UN 3481 under PI 966.'])],
        warnings: [SHIPPING_CAUTION],
      }),
    );
  }
  const claimCheck = claimAgainstMass(pack, ctx.claims);
  if (claimCheck && p.packMassKg !== undefined) {
    const se = specificEnergyWhPerKg(pack.energyWh, p.packMassKg);
    const { limitWhPerKg, floorWhPerKg } = SPECIFIC_ENERGY_LIMITS[p.chemistry];
    const warnings: string[] = [];
    if (se > limitWhPerKg) warnings.push(`${num(se)} Wh/kg is beyond what ${p.chemistry} cells reach (${limitWhPerKg} Wh/kg).`);
    if (se < floorWhPerKg) {
      warnings.push(
        `${num(se)} Wh/kg is below the ${floorWhPerKg} Wh/kg a ${p.chemistry} pack reaches even with its wiring: check the pack mass (${num(p.packMassKg * 1000)} g recorded) and its unit.`,
      );
    }
    ctx.figures.push(
      figure({
        key: 'pack.specificEnergy',
        label: 'Pack specific energy',
        value: se,
        unit: 'Wh/kg',
        family: 'pack.specificEnergy',
        inputs: [inp('packWh', 'Pack energy', pack.energyWh, 'Wh'), inp('packMassKg', 'Pack mass', p.packMassKg, 'kg')],
        assumptions: [`Plausible for ${p.chemistry}: ${floorWhPerKg}–${limitWhPerKg} Wh/kg; ${claimCheck.plausibility.source}.`],
        warnings,
        implausible: warnings.length > 0,
      }),
    );
  }
}

/** A capacity claim checked against the pack mass: what was checked (the device label, or the cell rating without one) and the result. */
export interface LabelClaimCheck {
  basis: 'label' | 'cell-rating';
  plausibility: ReturnType<typeof labelCapacityPlausibility>;
}

export function claimAgainstMass(pack: PackInfo, claims: NonNullable<TeardownFigureInput['claims']>): LabelClaimCheck | undefined {
  if (pack.p.packMassKg === undefined) return undefined;
  const onLabel = claims.capacityWh !== undefined || claims.capacityAh !== undefined;
  const claimedWh = claims.capacityWh ?? (claims.capacityAh !== undefined ? claims.capacityAh * pack.p.cellNominalVolts : pack.energyWh);
  return { basis: onLabel ? 'label' : 'cell-rating', plausibility: labelCapacityPlausibility({ claimedWh, cellMassKg: pack.p.packMassKg, chemistry: pack.p.chemistry }) };
}

/**
 * The check behind the capacity.implausible suggestion's mass reason, on its own: the label claim
 * (Wh, or Ah × cell nominal voltage, as labels quote mAh at the cell voltage; the cell rating when the
 * label is silent) against what the pack mass allows for its chemistry. Undefined without a pack or a pack mass.
 */
export function labelClaimCheck(input: Pick<TeardownFigureInput, 'pack' | 'claims'>): LabelClaimCheck | undefined {
  return input.pack ? claimAgainstMass(readPack(input.pack), input.claims ?? {}) : undefined;
}

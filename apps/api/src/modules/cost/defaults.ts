import type { CostModelDto } from '@splitcase/contracts';

/**
 * The cost model a new workspace starts from, until sourcing saves its own. Values are typical
 * of contract assembly of small battery-powered devices (REFERENCES §10 [CP]): SMT placement
 * $75/h ÷ 5 000 placements/h = $0.015 [S: industry expert panel]; attrition 1–5 % for passives,
 * 0.5–1 % for ICs; first-pass yield 95–99 %; insurance 0.5–2 % of the goods value [S/CP], here on
 * goods + freight (the CIF value duty is levied on).
 */
export const BUILT_IN_COST_MODEL: CostModelDto = {
  currency: 'USD',
  volumes: [1_000, 10_000, 100_000],
  attritionByCategory: {
    passive: 0.03,
    ic: 0.01,
    semiconductor: 0.01,
    inductor: 0.02,
    led: 0.02,
    connector: 0.01,
    pcb: 0.02,
    heater: 0.02,
    wire: 0.03,
    fastener: 0.02,
    label: 0.02,
    cell: 0.005,
  },
  defaultAttrition: 0.01,
  smtCostPerPlacement: 0.015,
  thtCostPerJoint: 0.03,
  thtJointsPerPart: 2,
  manualOperations: [
    { label: 'Spot-weld cell tabs', minutes: 1 },
    { label: 'Solder wires to the board', minutes: 1.5 },
    { label: 'Final assembly and gluing', minutes: 3 },
  ],
  labourRatePerHour: 4.5,
  testMinutes: 1.5,
  packagingCost: 0.2,
  firstPassYield: 0.97,
  overheadFraction: 0.12,
  freightFraction: 0.04,
  insuranceFraction: 0.01,
  insuranceBasis: 'cif',
  dutyFraction: 0.027,
  retailMarginFraction: 0.4,
  platformMarginFraction: 0.15,
  confidenceBand: { high: 0.05, medium: 0.15, low: 0.3 },
};

export {
  type AirTransportClass,
  AIR_TRANSPORT_CLASS_TEXT,
  packEnergyWh,
  runtimeHours,
  cRate,
  airTransportClass,
  specificEnergyWhPerKg,
} from './pack';
export {
  type CellChemistry,
  type CellVoltages,
  type PlausibilityResult,
  CELL_CHEMISTRIES,
  CELL_VOLTAGES,
  SPECIFIC_ENERGY_LIMITS,
  isLithiumChemistry,
  typicalCellVoltages,
  chargeVoltage,
  labelCapacityPlausibility,
} from './chemistry';
export { type ChargeTimeEstimate, chargeTimeEstimate, chargeTimeHours } from './charge-time';
export {
  type LabelCapacity,
  type LabelEnergyBasis,
  type MeasuredEnergyBasis,
  LABEL_WARN_FRACTION,
  labelEnergyWh,
  measuredVersusLabelEnergy,
} from './label';
export { type DcResistanceReadings, internalResistanceDc } from './internal-resistance';

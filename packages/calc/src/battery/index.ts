export { type AirTransportClass, AIR_TRANSPORT_CLASS_TEXT, AIR_TRANSPORT_CLASS_TEXT_INSTALLED, packEnergyWh, runtimeHours, cRate, airTransportClass, specificEnergyWhPerKg } from './pack';
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
export { type ShippingArrangement, type LithiumIonShipping, SHIPPING_ARRANGEMENTS, SECTION_II_CELL_WH, SECTION_II_BATTERY_WH, lithiumIonShipping } from './shipping';
export { LI_ION_SELF_DISCHARGE_PER_MONTH, HOURS_PER_MONTH, standbyMonths } from './standby';
export { packResistanceOhms, loadedTerminalVolts, resistiveLoadOnSource } from './loaded';
export { type LabelCapacity, type LabelEnergyBasis, type MeasuredEnergyBasis, LABEL_WARN_FRACTION, labelEnergyWh, measuredVersusLabelEnergy } from './label';
export { type DcResistanceReadings, internalResistanceDc } from './internal-resistance';

export { type Connection, requireConnection, powerFromVoltageAndResistance, currentFromVoltageAndResistance, combineResistances, pwmAveragePower, dutyForTargetPower, rmsVoltage } from './ohms-law';
export { type LoadElementsInput, type LoadPowerResult, loadPower } from './load-power';
export { resistanceAtTemperature } from './temperature';

export { COPPER_RESISTIVITY_IACS, COPPER_RESISTIVITY_PURE, COPPER_ALPHA_20, COPPER_OZ_THICKNESS_M, METRES_PER_MIL, ozToMetres, copperTraceResistance, copperSheetResistance } from './copper';
export { type TraceLayer, IPC2221, ipc2221ThicknessMil, ipc2221MaxCurrent, ipc2221MinWidth, ipc2221RangeWarnings } from './ipc2221';
export { powerDensityWPerCm2 } from './power-density';

export {
  type SurfaceMaterial,
  type BurnThresholdRow,
  SURFACE_MATERIALS,
  BURN_THRESHOLDS,
  burnThresholdDetail,
  burnThresholdC,
  touchMarginC,
} from './touch';
export {
  DEFAULT_CONVECTION_H,
  STEFAN_BOLTZMANN,
  surfaceTemperatureRiseC,
  radiativeHeatTransferCoefficient,
  dutyForTargetTemperatureRise,
} from './convection';

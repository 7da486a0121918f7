export { type SurfaceMaterial, type BurnThresholdRow, SURFACE_MATERIALS, isMetalSurface, BURN_THRESHOLDS, burnThresholdDetail, burnThresholdC, touchMarginC } from './touch';
export { DEFAULT_CONVECTION_H, STEFAN_BOLTZMANN, surfaceTemperatureRiseC, radiativeHeatTransferCoefficient, dutyForTargetTemperatureRise } from './convection';
export {
  type MaterialConstant,
  type SurfaceLoss,
  SURFACE_EMISSIVITY,
  SPECIFIC_HEAT,
  emissivityOf,
  surfaceHeatLossWatts,
  steadySurfaceRiseC,
  effectiveHeatTransferCoefficient,
  thermalTimeConstantSeconds,
  timeToRiseSeconds,
} from './surface';

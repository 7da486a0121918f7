// Public API of @splitcase/calc. Each area keeps its own index; import from the package root only.
export * from './shared/validate';
export * from './shared/explained';
export * from './electrical/index';
export * from './battery/index';
export * from './converters/index';
export * from './traces/index';
export * from './markings/index';
export * from './thermal/index';
export * from './figures/index';
export * from './runs/index';
export * from './cost/index';
export * from './compare/index';
export * from './bench/index';

// Bench tools: the marking decoder lives in markings/explain; heater-trace and runtime calculators here.
export { type BenchFigure, benchFigure } from './figure';
export { type HeaterTraceInput, type HeaterTraceReport, DEFAULT_TRACE_RISE_C, BENCH_AMBIENT_C, heaterTraceReport } from './heater-trace';
export { type RuntimeLoad, type RuntimeInput, type RuntimeReport, runtimeReport } from './runtime';

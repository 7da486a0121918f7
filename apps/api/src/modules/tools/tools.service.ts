// Bench tools: typed inputs in, explained figures out. Nothing is read from or written to the
// workspace; every figure comes from packages/calc (its RangeErrors become 422).
import { HEATER_TOOL_FIELDS, RUNTIME_TOOL_FIELDS, type FiguresToolResponse, type HeaterTraceToolBody, type MarkingToolResponse, type RuntimeToolBody } from '@splitcase/contracts';
import { explainMarking, heaterTraceReport, runtimeReport, type CellChemistry, type MarkingKind, type RuntimeLoad } from '@splitcase/calc';
import { readToolFields, toolValidationError, type ToolFieldSpec } from './inputs';

/** Decodes a marking or colour bands. */
export function decodeMarking(body: { code?: string | undefined; kind: MarkingKind; bands?: string[] | undefined }): MarkingToolResponse {
  return body.bands !== undefined ? explainMarking({ bands: body.bands }) : explainMarking({ code: body.code as string, kind: body.kind });
}

const H = HEATER_TOOL_FIELDS;
const HEATER_FIELDS = {
  length: { field: H.length, check: 'positive', required: true },
  width: { field: H.width, check: 'positive', required: true },
  thickness: { field: H.thickness, kind: 'copper-thickness', check: 'positive', required: true },
  temperature: { field: H.temperature, check: 'finite' },
  supplyVoltage: { field: H.supplyVoltage, check: 'positive' },
  current: { field: H.current, check: 'positive' },
  temperatureRise: { field: H.temperatureRise, kind: 'temperature-rise', check: 'positive' },
  area: { field: H.area, check: 'positive' },
} as const satisfies Record<string, ToolFieldSpec>;

/** Resistance, power, IPC-2221 capacity and width, power density and surface rise of a heater trace. */
export function heaterTrace(body: HeaterTraceToolBody): FiguresToolResponse {
  const { values: v, parsed, errors } = readToolFields(body, HEATER_FIELDS);
  if (Object.keys(errors).length > 0) throw toolValidationError(errors, parsed);
  const report = heaterTraceReport({
    lengthM: v.length as number,
    widthM: v.width as number,
    thicknessM: v.thickness as number,
    temperatureC: v.temperature,
    supplyVolts: v.supplyVoltage,
    currentA: v.current,
    temperatureRiseC: v.temperatureRise,
    layer: body.layer,
    areaM2: v.area,
  });
  return { parsed, ...report };
}

const R = RUNTIME_TOOL_FIELDS;
const RUNTIME_FIELDS = {
  cellNominalVoltage: { field: R.cellNominalVoltage, check: 'positive', required: true },
  cellCapacity: { field: R.cellCapacity, check: 'positive', required: true },
  series: { field: R.series, check: 'at-least-one' },
  parallel: { field: R.parallel, check: 'at-least-one' },
  loadPower: { field: R.loadPower, check: 'positive' },
  loadResistance: { field: R.loadResistance, check: 'positive' },
  supplyVoltage: { field: R.supplyVoltage, check: 'positive' },
  loadCurrent: { field: R.loadCurrent, check: 'positive' },
  efficiency: { field: R.efficiency, check: 'fraction' },
  usableFraction: { field: R.usableFraction, check: 'fraction' },
  duty: { field: R.duty, check: 'fraction' },
  cellMass: { field: R.cellMass, check: 'positive' },
} as const satisfies Record<string, ToolFieldSpec>;

const LOAD_FIELDS = ['loadPower', 'loadResistance', 'loadCurrent'] as const;
const given = (x: unknown) => x !== undefined && x !== null && !(typeof x === 'string' && x.trim() === '');

/** Pack energy, runtime, C-rate, transport class and (with a cell mass) specific energy and plausibility. */
export function runtime(body: RuntimeToolBody): FiguresToolResponse {
  const { values: v, parsed, errors } = readToolFields(body, RUNTIME_FIELDS);
  // Exactly one description of the load; a resistance needs the voltage across it.
  const loads = LOAD_FIELDS.filter((k) => given(body[k]));
  if (loads.length === 0) {
    errors.loadPower ??= 'Give the load power, the load resistance with a supply voltage, or the load current';
  }
  for (const extra of loads.slice(1)) errors[extra] ??= 'Give one load only: its power, its resistance with a supply voltage, or its current';
  if (loads[0] === 'loadResistance' && !given(body.supplyVoltage)) errors.supplyVoltage ??= 'Required with a load resistance';
  if (loads[0] !== 'loadResistance' && given(body.supplyVoltage)) errors.supplyVoltage ??= 'Only used with a load resistance';
  if (Object.keys(errors).length > 0) throw toolValidationError(errors, parsed);

  let load: RuntimeLoad;
  if (loads[0] === 'loadPower') load = { kind: 'power', watts: v.loadPower as number };
  else if (loads[0] === 'loadResistance') load = { kind: 'resistance', ohms: v.loadResistance as number, supplyVolts: v.supplyVoltage as number };
  else load = { kind: 'current', amps: v.loadCurrent as number };

  const report = runtimeReport({
    cellNominalVolts: v.cellNominalVoltage as number,
    cellCapacityAh: v.cellCapacity as number,
    series: v.series,
    parallel: v.parallel,
    load,
    efficiency: v.efficiency,
    usableFraction: v.usableFraction,
    duty: v.duty,
    cellMassKg: v.cellMass,
    chemistry: body.chemistry as CellChemistry | undefined,
  });
  return { parsed, ...report };
}

// The input and output shapes of the teardown figures, and the defaults they assume.
import type { Explained, FigureInput } from '../shared/explained';
import type { Connection } from '../electrical/index';
import type { CellChemistry } from '../battery/index';
import type { TraceLayer } from '../traces/index';
import type { SurfaceMaterial } from '../thermal/index';

export type LoadKind = 'heater' | 'motor' | 'led' | 'usb-output' | 'other';
export type ConverterTopology = 'buck' | 'boost' | 'buck-boost';
export type ConverterRole = 'charge' | 'output' | 'load';
export type SuggestionKind = 'cost-down' | 'safety' | 'reliability' | 'manufacturability' | 'user-experience' | 'compliance' | 'clever-idea';
export type SuggestionSeverity = 'note' | 'minor' | 'major' | 'critical';

export interface TeardownPack {
  chemistry: CellChemistry;
  cellNominalVolts: number;
  cellMaxVolts?: number;
  cellRatedAh: number;
  cellMeasuredAh?: number;
  series: number;
  parallel: number;
  packMassKg?: number;
  protection: boolean;
}

export interface TeardownLoad {
  id: string;
  kind: LoadKind;
  label: string;
  /** Per element (Ω). */
  resistanceOhms?: number;
  /** Per element (A). */
  currentAmps?: number;
  /** Per element (W). */
  powerWatts?: number;
  /** Defaults to the converter's output voltage, or to the pack's nominal voltage. */
  supplyVolts?: number;
  count: number;
  connection: Connection;
  /** PWM duty 0..1 at the setting the figures describe. */
  duty: number;
  converterId?: string;
  /** Area that sheds the heat (both faces if both are exposed) (m²). */
  heatedAreaM2?: number;
  surfaceMaterial?: SurfaceMaterial;
  /** Material of a resistive element, for its resistance at temperature (the recorded resistance is taken at 20 °C). */
  elementMaterial?: ElementMaterial;
  /** Mass that heats up with the element (pad, plate, shell) for the thermal time constant (kg). */
  heatedMassKg?: number;
}

/** Materials whose temperature coefficient of resistance is known: copper (flexible-PCB and etched-foil traces). */
export type ElementMaterial = 'copper' | 'other';
export const ELEMENT_MATERIALS: readonly ElementMaterial[] = ['copper', 'other'];

/** An operating mode: the loads active in it, each at its duty, and the standby current. */
export interface TeardownMode {
  id: string;
  name: string;
  note?: string;
  loads: { loadId: string; duty: number }[];
  /** Current the electronics draw from the pack in this mode besides the loads (A). */
  quiescentAmps?: number;
}

export interface TeardownConverter {
  id: string;
  topology: ConverterTopology;
  role: ConverterRole;
  vin: number;
  vout: number;
  /** 0..1; defaults to 0.9 (assumed) when absent. */
  efficiency?: number;
  efficiencySource: 'measured' | 'assumed';
  /** For a charge converter: the current it puts into the pack in the constant-current phase (A). */
  chargeCurrentA?: number;
}

export interface TeardownTrace {
  id: string;
  label: string;
  lengthM: number;
  widthM: number;
  thicknessM: number;
  currentA: number;
  layer: TraceLayer;
  /** Allowed temperature rise for the IPC-2221 rating; defaults to 10 °C. */
  allowedRiseC?: number;
}

export interface TeardownFigureInput {
  pack?: TeardownPack;
  loads: TeardownLoad[];
  converters: TeardownConverter[];
  /** Categories of the BOM lines, e.g. 'cell', 'ic', 'passive', 'sensor', 'heater'. */
  partCategories: string[];
  /** Label claims: outputWatts is the output (a USB port's); powerWatts the power claimed for the heat, light or motion. */
  claims?: { capacityAh?: number; capacityWh?: number; runtimeH?: number; outputWatts?: number; powerWatts?: number };
  /** Pack capacity delivered in a bench run, at the pack terminals (Ah). */
  measuredCapacityAh?: number;
  /** Measured ÷ label below this is flagged; default 0.9. */
  capacityWarnFraction?: number;
  traces?: TeardownTrace[];
  /** Contact time for the burn threshold; default 60 s for a hand-held heater. */
  contactSeconds?: number;
  /** Ambient temperature for the surface estimate; default 25 °C (IEC 62368-1 reference ambient). */
  ambientC?: number;
  /**
   * The hottest surface temperature measured at the bench (e.g. the steady state of a thermal run),
   * with where it comes from. When given, the touch margin uses it instead of the estimate.
   */
  measuredSurface?: { temperatureC: number; basis: string };
  /** Operating modes; without any the figures take every load at its own duty at once, and say so. */
  modes?: TeardownMode[];
  /** The device category (e.g. 'pocket-heater', 'power-bank'): how the battery ships and which wording applies. */
  deviceCategory?: string;
  /** Why the contact time is what it is ("set on this teardown", "workspace default for pocket heaters"). */
  contactBasis?: string;
  /** Share of the rated energy usable down to cut-off when no bench run measured it; default 0.9. */
  usableFraction?: number;
  /** Surface temperature the duty-for-target figure aims at; default 45 °C. */
  targetSurfaceC?: number;
  /** The latest discharge bench run: delivered charge and energy at the pack terminals, mean V² of the log. */
  measuredDischarge?: { ampHours: number; wattHours?: number; meanSquareVolts?: number; durationSeconds?: number; basis: string };
  /** Cell internal resistance (DC method), with where it comes from. */
  cellInternalResistance?: { ohms: number; basis: string };
  /** The latest power-bank bench run: conversion efficiency and the energy delivered at the output. */
  powerBankRun?: { efficiency: number; deliveredWh: number; outputVolts?: number; basis: string };
}

/** A derived figure with how it was obtained. */
export interface Figure extends Explained<number | string> {
  /** Stable key, e.g. 'load.power', 'load.heater-1.power', 'trace.t1.rating', 'mode.runtime.hours'. */
  key: string;
  label: string;
  /** The operating mode a per-mode figure describes; absent for whole-device figures. */
  modeId?: string;
  /** The value is outside what the physics or the chemistry allows: shown flagged, never as good. */
  implausible?: boolean;
  /** Every input carries a stable key within its figure. */
  inputs: KeyedInput[];
}

/** A figure input with a stable key, so that nothing reads an input by its label. */
export interface KeyedInput extends FigureInput {
  key: string;
}

/** A proposed finding the engineer can accept or dismiss. */
export interface Suggestion {
  /** Stable key, e.g. 'thermal.no-sensor'. */
  key: string;
  title: string;
  kind: SuggestionKind;
  severity: SuggestionSeverity;
  detail: string;
}

export interface TeardownFiguresResult {
  figures: Figure[];
  suggestions: Suggestion[];
}

/** Defaults the figures assume when the records are silent; each use is stated in the figure's assumptions. */
export const FIGURE_DEFAULTS = {
  converterEfficiency: 0.9,
  capacityWarnFraction: 0.9,
  contactSeconds: 60,
  ambientC: 25,
  traceRiseC: 10,
  surfaceMaterial: 'metal' as SurfaceMaterial,
  /** Share of the rated energy usable to cut-off [CP]. */
  usableFraction: 0.9,
  targetSurfaceC: 45,
  /** Claimed output within ±10 % of the computed one passes [CP]. */
  claimTolerance: 0.1,
} as const;

export const HOT_SURFACE_CAUTION =
  'Hot surface: measure the real surface temperature with a thermocouple before anyone holds the device, keep skin contact short, ' +
  "and follow the lab's safety rules. These figures are estimates for engineering judgement, not certification results.";

// Heaters: surface temperature (convection + exact radiation, emissivity of the surface material),
// resistance at temperature for copper elements, touch margin at the contact time, thermal transient,
// and the duty that holds a target temperature. One model, shared with the bench tools (thermal/surface.ts).
import { resistanceAtTemperature } from '../electrical/index';
import {
  DEFAULT_CONVECTION_H,
  SPECIFIC_HEAT,
  burnThresholdDetail,
  effectiveHeatTransferCoefficient,
  emissivityOf,
  steadySurfaceRiseC,
  surfaceHeatLossWatts,
  thermalTimeConstantSeconds,
  timeToRiseSeconds,
  type SurfaceMaterial,
} from '../thermal/index';
import { COPPER_ALPHA_20, powerDensityWPerCm2 } from '../traces/index';
import { requireFinite } from '../shared/validate';
import { figure, inp, num } from './build';
import type { FigureContext } from './context';
import type { LoadInfo } from './loads';
import { FIGURE_DEFAULTS, HOT_SURFACE_CAUTION, type Figure } from './types';

/** An estimate that misses a measured rise by more than this share is said to disagree. */
export const ESTIMATE_DISAGREEMENT = 0.3;

export interface HeaterState {
  info: LoadInfo;
  duty: number;
  area: number;
  material: SurfaceMaterial;
  materialAssumed: boolean;
  emissivity: { value: number; source: string };
  /** Full-duty power at the recorded (20 °C) resistance (W). */
  coldFullWatts: number;
  /** Full-duty power at operating temperature (copper elements), else the cold power (W). */
  fullWatts: number;
  avgWatts: number;
  /** Resistance at operating temperature, for copper elements. */
  hot?: { ohmsAt20: number; ohms: number; temperatureC: number };
  /** Steady rise at the duty, estimated (K). */
  rise: number;
  estimatedSurface: number;
  /** The surface temperature the margin uses: measured when given, else the estimate. */
  surface: number;
  measured?: { temperatureC: number; basis: string };
  threshold: ReturnType<typeof burnThresholdDetail>;
  margin: number;
  /** Effective heat-transfer coefficient at the steady state (W/m²K). */
  hEffective: number;
  transient?: { massKg: number; specificHeat: number; tauSeconds: number; toThresholdSeconds: number | null };
}

const HEATER_ASSUMPTION = (s: HeaterState) =>
  `Heat leaves the heated area by free convection, h = ${DEFAULT_CONVECTION_H} W/m²K (2–25 W/m²K in air [S: Çengel]), and by radiation, εσ(T_s⁴ − T_a⁴) exact in T⁴ ` +
  `with ε ${s.emissivity.value} for ${s.material} (${s.emissivity.source}${s.materialAssumed ? '; material not recorded, bare metal assumed' : ''}). ` +
  'Heat that spreads into a larger shell lowers the real temperature; a hand or pocket holds heat in and raises it.';

/** The steady state of a heater at a duty (it must have a heated area). */
export function heaterAt(ctx: FigureContext, info: LoadInfo, duty: number): HeaterState {
  const load = info.load;
  const area = load.heatedAreaM2 as number;
  const material = load.surfaceMaterial ?? FIGURE_DEFAULTS.surfaceMaterial;
  const emissivity = emissivityOf(material);
  const loss = { areaM2: area, ambientC: ctx.ambientC, emissivity: emissivity.value };
  const cold = info.r.totalWatts;
  let full = cold;
  let rise = steadySurfaceRiseC({ ...loss, watts: duty * cold });
  let hot: HeaterState['hot'];
  if (load.elementMaterial === 'copper' && info.r.basis === 'resistance' && duty > 0) {
    // At a fixed supply voltage P ∝ 1/R(T); iterate P → T → R(T) → P to the self-consistent point.
    const r20 = info.r.elementOhms;
    let ohms = r20;
    for (let k = 0; k < 100; k++) {
      const t = ctx.ambientC + rise;
      ohms = resistanceAtTemperature({ ohmsAt20: r20, alphaPerK: COPPER_ALPHA_20, temperatureC: t });
      full = (cold * r20) / ohms;
      const next = steadySurfaceRiseC({ ...loss, watts: duty * full });
      const done = Math.abs(next - rise) < 1e-9;
      rise = next;
      if (done) break;
    }
    hot = { ohmsAt20: r20, ohms, temperatureC: ctx.ambientC + rise };
  }
  const threshold = burnThresholdDetail({ material, contactSeconds: ctx.contact.seconds });
  const estimatedSurface = ctx.ambientC + rise;
  const hEffective = rise > 0 ? effectiveHeatTransferCoefficient({ ...loss, riseC: rise }) : DEFAULT_CONVECTION_H;
  const state: HeaterState = {
    info,
    duty,
    area,
    material,
    materialAssumed: load.surfaceMaterial === undefined,
    emissivity,
    coldFullWatts: cold,
    fullWatts: full,
    avgWatts: duty * full,
    hot,
    rise,
    estimatedSurface,
    surface: estimatedSurface,
    threshold,
    margin: threshold.thresholdC - estimatedSurface,
    hEffective,
  };
  if (load.heatedMassKg !== undefined && rise > 0) {
    const c = SPECIFIC_HEAT[material].value;
    const tau = thermalTimeConstantSeconds({ massKg: load.heatedMassKg, specificHeat: c, hWPerM2K: hEffective, areaM2: area });
    const toThreshold = timeToRiseSeconds({ timeConstantSeconds: tau, steadyRiseC: rise, riseC: Math.max(0, threshold.thresholdC - ctx.ambientC) });
    state.transient = { massKg: load.heatedMassKg, specificHeat: c, tauSeconds: tau, toThresholdSeconds: toThreshold };
  }
  return state;
}

/** A bench measurement beats the estimate: the state takes it for its margin. */
export function applyMeasured(state: HeaterState, measured: { temperatureC: number; basis: string }): void {
  requireFinite(measured.temperatureC, 'Measured surface temperature (°C)');
  state.measured = measured;
  state.surface = measured.temperatureC;
  state.margin = state.threshold.thresholdC - measured.temperatureC;
}

export const hottest = (list: HeaterState[]) => list.reduce((a, b) => (b.margin < a.margin ? b : a));

export function powerDensityFigure(h: { info: LoadInfo; area: number }, key: string, label: string): Figure {
  return figure({
    key,
    label,
    value: powerDensityWPerCm2(h.info.r.totalWatts, h.area),
    unit: 'W/cm²',
    family: 'heater.powerDensity',
    inputs: [inp('heaterWatts', `${h.info.load.label} power`, h.info.r.totalWatts, 'W'), inp('heatedAreaM2', 'Heated area', h.area, 'm²')],
  });
}

function estimateInputs(h: HeaterState) {
  return [
    inp('averageWatts', `${h.info.load.label} average power`, h.avgWatts, 'W'),
    inp('duty', 'Duty', h.duty),
    inp('heatedAreaM2', 'Heated area', h.area, 'm²'),
    inp('ambientC', 'Ambient', h.estimatedSurface - h.rise, '°C'),
    inp('emissivity', 'Emissivity', h.emissivity.value),
    inp('hConvection', 'Convection coefficient', DEFAULT_CONVECTION_H, 'W/m²K'),
    inp('hEffective', 'Effective heat-transfer coefficient (convection + radiation)', h.hEffective, 'W/m²K'),
  ];
}

function estimateAssumptions(ctx: FigureContext, h: HeaterState): string[] {
  return [
    HEATER_ASSUMPTION(h),
    ...(h.hot
      ? [`Copper element: R(T) = R₂₀(1 + 0.00393 × (T − 20 °C)) at the surface temperature, ${num(h.hot.ohmsAt20)} → ${num(h.hot.ohms, 4)} Ω; the recorded resistance is taken at 20 °C.`]
      : []),
    ...(ctx.ambientAssumed ? [`Ambient ${FIGURE_DEFAULTS.ambientC} °C assumed.`] : []),
    'Estimate for engineering judgement, not a certification result.',
  ];
}

function disagreement(h: HeaterState): string[] {
  if (!h.measured) return [];
  const measuredRise = h.measured.temperatureC - (h.estimatedSurface - h.rise);
  if (!(measuredRise > 0)) return [];
  const off = (h.rise - measuredRise) / measuredRise;
  return Math.abs(off) > ESTIMATE_DISAGREEMENT
    ? [
        `The estimate (${num(h.estimatedSurface)} °C) disagrees with the measured ${num(h.measured.temperatureC)} °C by ${num(Math.abs(off) * 100, 2)} % of the rise: check the heated area, the surface material and the duty.`,
      ]
    : [];
}

export function surfaceRiseFigure(ctx: FigureContext, h: HeaterState, key: string, label: string, modeId?: string): Figure {
  const full = steadySurfaceRiseC({ watts: h.fullWatts, areaM2: h.area, ambientC: ctx.ambientC, emissivity: h.emissivity.value });
  return figure({
    key,
    label,
    value: h.rise,
    unit: '°C',
    family: 'heater.surfaceRise',
    inputs: estimateInputs(h),
    assumptions: [...estimateAssumptions(ctx, h), `Steady state at duty ${num(h.duty)}; at full duty the rise would be ${num(full)} °C.`],
    modeId,
  });
}

export function surfaceTemperatureFigure(ctx: FigureContext, h: HeaterState, key: string, label: string, modeId?: string): Figure {
  return figure({
    key,
    label,
    value: h.surface,
    unit: '°C',
    family: h.measured ? 'heater.surfaceMeasured' : 'heater.surfaceTemperature',
    inputs: h.measured
      ? [
          inp('measuredSurfaceC', 'Measured surface temperature', h.measured.temperatureC, '°C'),
          inp('measuredIn', 'Measured in', h.measured.basis),
          inp('estimatedSurfaceC', 'Estimated surface temperature (for comparison)', h.estimatedSurface, '°C'),
          ...estimateInputs(h),
        ]
      : [...estimateInputs(h), inp('surfaceRise', 'Surface rise', h.rise, '°C')],
    assumptions: estimateAssumptions(ctx, h),
    warnings: disagreement(h),
    modeId,
  });
}

export function touchMarginFigure(ctx: FigureContext, h: HeaterState, key: string, label: string, modeId?: string): Figure {
  const warnings =
    h.margin < 0
      ? [
          `${h.measured ? 'Measured' : 'Estimated'} surface ${num(h.surface)} °C is above the ${h.threshold.thresholdC} °C burn threshold for ${ctx.contact.text} contact with ${h.material}.`,
          HOT_SURFACE_CAUTION,
        ]
      : [];
  return figure({
    key,
    label,
    value: h.margin,
    unit: '°C',
    family: 'heater.touchMargin',
    inputs: [
      ...(h.measured
        ? [
            inp('measuredSurfaceC', 'Measured surface temperature', h.surface, '°C'),
            inp('measuredIn', 'Measured in', h.measured.basis),
            inp('estimatedSurfaceC', 'Estimated surface temperature (for comparison)', h.estimatedSurface, '°C'),
          ]
        : [inp('ambientC', 'Ambient', ctx.ambientC, '°C'), inp('surfaceRise', 'Surface rise', h.rise, '°C'), inp('estimatedSurfaceC', 'Estimated surface temperature', h.surface, '°C')]),
      inp('surfaceMaterial', 'Surface material', h.material),
      inp('contactSeconds', 'Contact time', ctx.contact.seconds, 's'),
      inp('thresholdC', 'Burn threshold', h.threshold.thresholdC, '°C'),
    ],
    assumptions: [
      h.threshold.source,
      'For a contact time between listed durations the next longer listed duration is used (conservative).',
      ctx.contact.assumption,
      ...(ctx.ambientAssumed ? [`Ambient ${FIGURE_DEFAULTS.ambientC} °C assumed.`] : []),
      ...(h.materialAssumed ? ['Surface material not recorded; bare metal assumed (the lowest thresholds, the least radiation).'] : []),
    ],
    warnings: [...warnings, ...disagreement(h)],
    modeId,
  });
}

/** Power at operating temperature of a copper element, and the transient to the burn threshold. */
export function heaterExtraFigures(ctx: FigureContext, h: HeaterState, prefix: string, labelPrefix: string, modeId?: string): Figure[] {
  const out: Figure[] = [];
  if (h.hot) {
    out.push(
      figure({
        key: `${prefix}.powerHot`,
        label: `${labelPrefix}power at operating temperature (full duty)`,
        value: h.fullWatts,
        unit: 'W',
        family: 'heater.powerHot',
        inputs: [
          inp('ohmsAt20', 'Element resistance at 20 °C', h.hot.ohmsAt20, 'Ω'),
          inp('alpha', 'Temperature coefficient (copper)', COPPER_ALPHA_20, '/K'),
          inp('temperatureC', 'Element temperature', h.hot.temperatureC, '°C'),
          inp('ohmsHot', 'Element resistance at temperature', h.hot.ohms, 'Ω'),
          inp('coldWatts', 'Power at 20 °C', h.coldFullWatts, 'W'),
        ],
        assumptions: [
          'The element runs at the surface temperature (thin flexible heater bonded to the surface).',
          'Supply voltage held constant: P = V²/R(T).',
          'Temperature and power solved together (the hotter element draws less).',
        ],
        modeId,
      }),
    );
  }
  if (h.transient) {
    const t = h.transient;
    out.push(
      figure({
        key: `${prefix}.timeConstant`,
        label: `${labelPrefix}thermal time constant`,
        value: t.tauSeconds,
        unit: 's',
        family: 'heater.timeConstant',
        inputs: [
          inp('heatedMassKg', 'Heated mass', t.massKg, 'kg'),
          inp('specificHeat', `Specific heat (${h.material})`, t.specificHeat, 'J/(kg·K)'),
          inp('hEffective', 'Effective heat-transfer coefficient', h.hEffective, 'W/m²K'),
          inp('heatedAreaM2', 'Heated area', h.area, 'm²'),
        ],
        assumptions: [`${SPECIFIC_HEAT[h.material].source}; the heated mass taken as the surface material.`, 'Lumped capacitance: one temperature through the heated mass (Bi < 0.1).'],
        modeId,
      }),
      figure({
        key: `${prefix}.timeToThreshold`,
        label: `${labelPrefix}time from cold to the burn threshold`,
        value: t.toThresholdSeconds ?? 'not reached',
        unit: t.toThresholdSeconds === null ? '' : 's',
        family: 'heater.timeToThreshold',
        inputs: [
          inp('tauSeconds', 'Time constant', t.tauSeconds, 's'),
          inp('steadyRise', 'Steady rise', h.rise, '°C'),
          inp('thresholdRise', 'Rise to the burn threshold', h.threshold.thresholdC - ctx.ambientC, '°C'),
        ],
        assumptions: ['Starts at ambient; first-order rise T(t) = T_a + ΔT_ss·(1 − e^(−t/τ)).'],
        warnings:
          t.toThresholdSeconds !== null ? [`The surface passes the ${h.threshold.thresholdC} °C threshold after about ${num(t.toThresholdSeconds / 60, 2)} min of use.`, HOT_SURFACE_CAUTION] : [],
        modeId,
      }),
    );
  }
  return out;
}

/** PWM duty that holds the target surface temperature, with the exact loss and (copper) the resistance at that temperature. */
export function dutyForTargetFigure(ctx: FigureContext, info: LoadInfo, key: string, label: string): Figure | undefined {
  const load = info.load;
  const area = load.heatedAreaM2;
  if (area === undefined) return undefined;
  const target = ctx.targetSurfaceC;
  const riseC = target - ctx.ambientC;
  if (!(riseC > 0)) return undefined;
  const material = load.surfaceMaterial ?? FIGURE_DEFAULTS.surfaceMaterial;
  const emissivity = emissivityOf(material);
  const needed = surfaceHeatLossWatts({ riseC, areaM2: area, ambientC: ctx.ambientC, emissivity: emissivity.value });
  const copper = load.elementMaterial === 'copper' && info.r.basis === 'resistance';
  const full = copper ? (info.r.totalWatts * info.r.elementOhms) / resistanceAtTemperature({ ohmsAt20: info.r.elementOhms, alphaPerK: COPPER_ALPHA_20, temperatureC: target }) : info.r.totalWatts;
  const raw = needed / full;
  return figure({
    key,
    label,
    value: Math.min(1, raw),
    unit: '',
    family: 'heater.dutyForTarget',
    inputs: [
      inp('targetC', 'Target surface temperature', target, '°C'),
      inp('ambientC', 'Ambient', ctx.ambientC, '°C'),
      inp('neededWatts', 'Heat the surface sheds at the target', needed, 'W'),
      inp('fullWatts', `${load.label} power at full duty${copper ? ' (at the target temperature)' : ''}`, full, 'W'),
      inp('emissivity', 'Emissivity', emissivity.value),
    ],
    assumptions: [
      `Target ${num(target)} °C${ctx.input.targetSurfaceC === undefined ? ' (a warm surface below the 48 °C ten-minute threshold [CP])' : ''}.`,
      'Steady state: the PWM period is much shorter than the thermal time constant, so the average power sets the temperature.',
      'Holding the target in use needs a temperature sensor and feedback; a fixed duty holds it only at this ambient and with nothing covering the heater.',
    ],
    warnings:
      raw > 1
        ? [
            `Out of reach: at full duty the surface reaches only about ${num(ctx.ambientC + steadySurfaceRiseC({ watts: full, areaM2: area, ambientC: ctx.ambientC, emissivity: emissivity.value }))} °C.`,
          ]
        : [],
  });
}

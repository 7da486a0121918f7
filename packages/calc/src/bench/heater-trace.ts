/**
 * The heater-trace calculator of the bench tools: resistance of a copper trace at a temperature,
 * power at a supply voltage (or current), IPC-2221 current capacity and minimum width, power
 * density over the heated area and a steady surface-rise estimate, each with formula and source.
 */
import { burnThresholdDetail } from '../thermal/touch';
import { DEFAULT_CONVECTION_H } from '../thermal/convection';
import { emissivityOf, steadySurfaceRiseC } from '../thermal/surface';
import type { SurfaceMaterial } from '../thermal/touch';
import { requireFinite, requirePositive } from '../shared/validate';
import { plain, withPrefix } from '../shared/text';
import { COPPER_ALPHA_20, COPPER_RESISTIVITY_IACS, COPPER_RESISTIVITY_PURE, METRES_PER_MIL, copperTraceResistance } from '../traces/copper';
import { ipc2221MaxCurrent, ipc2221MinWidth, ipc2221RangeWarnings, ipc2221ThicknessMil, type TraceLayer } from '../traces/ipc2221';
import { powerDensityWPerCm2 } from '../traces/power-density';
import { benchFigure, type BenchFigure } from './figure';

/** Allowed rise when none is given: 10 °C, the most conservative curve of the IPC-2221 charts [CP]. */
export const DEFAULT_TRACE_RISE_C = 10;
/** Ambient assumed for the surface-temperature estimate (°C). */
export const BENCH_AMBIENT_C = 25;

export interface HeaterTraceInput {
  lengthM: number;
  widthM: number;
  thicknessM: number;
  /** Trace temperature for the resistance (°C); default 20 °C. */
  temperatureC?: number | undefined;
  supplyVolts?: number | undefined;
  /** Design current (A); without it the current at the supply voltage is used. */
  currentA?: number | undefined;
  /** Allowed rise for the IPC-2221 rating (°C); default 10 °C. */
  temperatureRiseC?: number | undefined;
  layer: TraceLayer;
  /** Heated area for power density and the surface estimate (m²). */
  areaM2?: number | undefined;
  /** Surface of the pad, for its emissivity and burn thresholds; default plastic (a polyimide or PET film). */
  surfaceMaterial?: SurfaceMaterial | undefined;
}

export interface HeaterTraceReport {
  figures: BenchFigure[];
  /** Every warning of every figure, for a summary. */
  warnings: string[];
}

const IACS_ASSUMPTION = 'IACS annealed copper: ρ₂₀ = 1.7241 × 10⁻⁸ Ω·m with α₂₀ = 0.00393 /K, a consistent pair [S: IEC 60028].';

/** Resistance, power, IPC-2221 capacity and width, power density and surface rise of a copper heater trace, explained. */
export function heaterTraceReport(p: HeaterTraceInput): HeaterTraceReport {
  const lengthM = requirePositive(p.lengthM, 'Trace length (m)');
  const widthM = requirePositive(p.widthM, 'Trace width (m)');
  const thicknessM = requirePositive(p.thicknessM, 'Copper thickness (m)');
  const temperatureC = requireFinite(p.temperatureC ?? 20, 'Temperature (°C)');
  const riseC = requirePositive(p.temperatureRiseC ?? DEFAULT_TRACE_RISE_C, 'Allowed temperature rise (°C)');
  const supplyVolts = p.supplyVolts === undefined ? undefined : requirePositive(p.supplyVolts, 'Supply voltage (V)');
  const givenCurrent = p.currentA === undefined ? undefined : requirePositive(p.currentA, 'Current (A)');
  const areaM2 = p.areaM2 === undefined ? undefined : requirePositive(p.areaM2, 'Heated area (m²)');
  if (p.layer !== 'external' && p.layer !== 'internal') {
    throw new RangeError(`Trace layer must be "external" or "internal" (got "${String(p.layer)}").`);
  }

  const figures: BenchFigure[] = [];
  const geometry = [
    { label: 'Length', value: lengthM, unit: 'm' },
    { label: 'Width', value: widthM, unit: 'm' },
    { label: 'Copper thickness', value: thicknessM, unit: 'm' },
  ];

  // Resistance at the trace temperature.
  const ohms = copperTraceResistance({ lengthM, widthM, thicknessM, temperatureC });
  const pureOhms = copperTraceResistance({ lengthM, widthM, thicknessM, temperatureC, resistivityOhmM: COPPER_RESISTIVITY_PURE });
  figures.push(
    benchFigure({
      key: 'resistance',
      label: `Trace resistance at ${plain(temperatureC)} °C`,
      value: ohms,
      unit: 'Ω',
      formulaKey: 'trace.resistance',
      inputs: [
        ...geometry,
        { label: 'Temperature', value: temperatureC, unit: '°C' },
        { label: 'Resistivity ρ₂₀', value: COPPER_RESISTIVITY_IACS, unit: 'Ω·m' },
        { label: 'Temperature coefficient α₂₀', value: COPPER_ALPHA_20, unit: '/K' },
      ],
      assumptions: [
        IACS_ASSUMPTION,
        `The CRC Handbook value for pure copper, ρ = 1.678 × 10⁻⁸ Ω·m [M], would give ${withPrefix(pureOhms, 'Ω')}; PCB copper (electrodeposited or rolled) is close to IACS.`,
        ...(p.temperatureC === undefined ? ['Trace temperature 20 °C assumed.'] : []),
        'Uniform width and thickness; bends and pads are ignored.',
      ],
    }),
  );

  // Operating point: power and current at the supply, or power and voltage at a given current.
  let watts: number | undefined;
  let designCurrent = givenCurrent;
  if (supplyVolts !== undefined) {
    const amps = supplyVolts / ohms;
    watts = (supplyVolts * supplyVolts) / ohms;
    const supplyInputs = [
      { label: 'Supply voltage', value: supplyVolts, unit: 'V' },
      { label: 'Trace resistance', value: ohms, unit: 'Ω' },
    ];
    const currentWarnings: string[] = [];
    if (givenCurrent !== undefined && Math.abs(givenCurrent - amps) > 0.05 * amps) {
      currentWarnings.push(
        `The current given (${withPrefix(givenCurrent, 'A')}) differs from the ${withPrefix(amps, 'A')} the supply drives through this trace; the IPC-2221 checks use the current given.`,
      );
    }
    designCurrent ??= amps;
    figures.push(
      benchFigure({
        key: 'current',
        label: 'Current at the supply voltage',
        value: amps,
        unit: 'A',
        formulaKey: 'electrical.current',
        inputs: supplyInputs,
        assumptions: ['The whole supply voltage is across the trace (leads, switch and cell resistance ignored).'],
        warnings: currentWarnings,
      }),
      benchFigure({
        key: 'power',
        label: 'Power at the supply voltage',
        value: watts,
        unit: 'W',
        formulaKey: 'electrical.power',
        inputs: supplyInputs,
        assumptions: ['Resistance taken at the trace temperature; a heater warming up draws more at first (copper rises about 0.39 % per °C).'],
      }),
    );
  } else if (givenCurrent !== undefined) {
    watts = givenCurrent * givenCurrent * ohms;
    const currentInputs = [
      { label: 'Current', value: givenCurrent, unit: 'A' },
      { label: 'Trace resistance', value: ohms, unit: 'Ω' },
    ];
    figures.push(
      benchFigure({
        key: 'voltage',
        label: 'Voltage across the trace',
        value: givenCurrent * ohms,
        unit: 'V',
        formulaKey: 'electrical.voltageDrop',
        inputs: currentInputs,
      }),
      benchFigure({ key: 'power', label: 'Power at the current', value: watts, unit: 'W', formulaKey: 'electrical.powerFromCurrent', inputs: currentInputs }),
    );
  }

  // IPC-2221 capacity at the allowed rise.
  const thicknessMil = ipc2221ThicknessMil(thicknessM);
  const maxCurrent = ipc2221MaxCurrent({ widthM, thicknessM, temperatureRiseC: riseC, layer: p.layer });
  const fitAssumptions = [
    ...(p.temperatureRiseC === undefined ? [`Allowed rise ${DEFAULT_TRACE_RISE_C} °C assumed (the most conservative IPC-2221 curve) [CP].`] : []),
    'Copper thickness as oz/ft² × 1.378 mil (1 oz/ft² = 35 µm), as IPC-2221 calculators take it [S].',
    'Curve fit to the IPC-2221 conductor charts, quoted as valid to 35 A, 400 mil wide and ΔT 10–100 °C [M].',
  ];
  const ratingWarnings = ipc2221RangeWarnings({ widthM, temperatureRiseC: riseC });
  if (designCurrent !== undefined && designCurrent > maxCurrent) {
    ratingWarnings.push(
      `${withPrefix(designCurrent, 'A')} is above the ${withPrefix(maxCurrent, 'A')} this trace carries at a ${plain(riseC)} °C rise: it will run hotter than that. For a heater that may be the intent; check the laminate's temperature rating.`,
    );
  }
  figures.push(
    benchFigure({
      key: 'maxCurrent',
      label: `IPC-2221 maximum current at ΔT ${plain(riseC)} °C`,
      value: maxCurrent,
      unit: 'A',
      formulaKey: 'trace.rating',
      inputs: [
        { label: 'Width', value: widthM / METRES_PER_MIL, unit: 'mil' },
        { label: 'Copper thickness', value: thicknessMil, unit: 'mil' },
        { label: 'Cross-section', value: (widthM / METRES_PER_MIL) * thicknessMil, unit: 'mil²' },
        { label: 'Allowed rise', value: riseC, unit: '°C' },
        { label: 'Layer', value: p.layer },
        { label: 'k', value: p.layer === 'external' ? 0.048 : 0.024 },
      ],
      assumptions: fitAssumptions,
      warnings: ratingWarnings,
    }),
  );

  if (designCurrent !== undefined) {
    const minWidth = ipc2221MinWidth({ currentA: designCurrent, thicknessM, temperatureRiseC: riseC, layer: p.layer });
    figures.push(
      benchFigure({
        key: 'minWidth',
        label: `IPC-2221 minimum width for ${withPrefix(designCurrent, 'A', 3)}`,
        value: minWidth,
        unit: 'm',
        formulaKey: 'trace.minWidth',
        inputs: [
          { label: givenCurrent !== undefined ? 'Current' : 'Current at the supply voltage', value: designCurrent, unit: 'A' },
          { label: 'Copper thickness', value: thicknessMil, unit: 'mil' },
          { label: 'Allowed rise', value: riseC, unit: '°C' },
          { label: 'Layer', value: p.layer },
        ],
        assumptions: fitAssumptions,
        warnings: ipc2221RangeWarnings({ currentA: designCurrent, widthM: minWidth }),
      }),
    );
  }

  if (areaM2 !== undefined && watts !== undefined) {
    const areaWarnings: string[] = [];
    if (areaM2 < lengthM * widthM) {
      areaWarnings.push(`The heated area (${plain(areaM2 * 1e4)} cm²) is smaller than the trace's own copper (${plain(lengthM * widthM * 1e4)} cm²): check the area.`);
    }
    const areaInputs = [
      { label: 'Power', value: watts, unit: 'W' },
      { label: 'Heated area', value: areaM2, unit: 'm²' },
    ];
    figures.push(
      benchFigure({
        key: 'powerDensity',
        label: 'Power density over the heated area',
        value: powerDensityWPerCm2(watts, areaM2),
        unit: 'W/cm²',
        formulaKey: 'heater.powerDensity',
        inputs: areaInputs,
        assumptions: ['Power spread evenly over the heated area.'],
        warnings: areaWarnings,
      }),
    );
    // Both faces of a bare heater pad shed heat (REFERENCES §7 takes both faces of a slab), by the
    // same convection + exact radiation model as the teardown figures (thermal/surface.ts).
    const material = p.surfaceMaterial ?? 'plastic';
    const emissivity = emissivityOf(material);
    const rise = steadySurfaceRiseC({ watts, areaM2: 2 * areaM2, ambientC: BENCH_AMBIENT_C, emissivity: emissivity.value });
    const surfaceC = BENCH_AMBIENT_C + rise;
    const touchWarnings: string[] = [];
    // The most severe contact time whose ISO 13732-1 threshold the estimate exceeds.
    for (const seconds of [60, 600, 8 * 3600]) {
      const t = burnThresholdDetail({ material, contactSeconds: seconds });
      if (surfaceC > t.thresholdC) {
        const duration = seconds === 60 ? '1 min' : seconds === 600 ? '10 min' : '8 h or more';
        touchWarnings.push(
          `An estimated surface of about ${plain(surfaceC, 3)} °C is above the ${t.thresholdC} °C burn threshold for ${duration} of contact with ${material} (${t.source}). Keep skin contact short or add a layer between heater and skin.`,
        );
        break;
      }
    }
    figures.push(
      benchFigure({
        key: 'surfaceRise',
        label: 'Steady surface rise, bare in still air (estimate)',
        value: rise,
        unit: '°C',
        formulaKey: 'heater.surfaceRise',
        inputs: [
          ...areaInputs,
          { label: 'Surface shedding heat (both faces)', value: 2 * areaM2, unit: 'm²' },
          { label: 'Convection coefficient h', value: DEFAULT_CONVECTION_H, unit: 'W/m²K' },
          { label: `Emissivity (${material})`, value: emissivity.value },
        ],
        assumptions: [
          `Heat leaves both faces of the heated area (2 × A) by free convection at h = ${DEFAULT_CONVECTION_H} W/m²K (2–25 W/m²K in air [S: Çengel]) and by radiation, εσ(T_s⁴ − T_a⁴) exact in T⁴ with ε ${emissivity.value} (${emissivity.source}).`,
          `Surface temperature ≈ ${BENCH_AMBIENT_C} °C ambient + rise = ${plain(surfaceC, 3)} °C; a hand or pocket insulates, so a covered heater runs hotter.`,
        ],
        warnings: touchWarnings,
      }),
    );
  }

  return { figures, warnings: figures.flatMap((f) => f.warnings) };
}

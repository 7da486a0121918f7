/**
 * Simple physical models that generate reproducible demo runs. They are
 * approximations for demonstration [M], not cell or heater data.
 */
import { requireFinite, requireFraction, requireNonNegative, requirePositive } from '../shared/validate';
import { optionalFinite } from './series';

/** Longest simulated log, in samples; beyond it the step is too small for the run. */
export const MAX_SIMULATED_SAMPLES = 2_000_000;

/** Seeded pseudo-random numbers in [0, 1) (mulberry32): the same seed always gives the same sequence. */
export function createSeededRandom(seed: number): () => number {
  requireFinite(seed, 'seed');
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}

/** Normal deviates (Box–Muller) from a uniform source. */
function normalSource(uniform: () => number): () => number {
  return () => {
    const u = 1 - uniform(); // (0, 1]
    const w = uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * w);
  };
}

/** Optional measurement noise for simulated runs: standard deviations and the seed. */
export interface SimulationNoise {
  seed: number;
  voltsSd?: number;
  ampsSd?: number;
  tempSd?: number;
}

function noiseSource(noise: SimulationNoise | undefined) {
  if (!noise) return { volts: () => 0, amps: () => 0, temp: () => 0 };
  const normal = normalSource(createSeededRandom(noise.seed));
  const sd = (value: number | undefined, name: string) => requireNonNegative(value ?? 0, name);
  const vSd = sd(noise.voltsSd, 'noise.voltsSd');
  const iSd = sd(noise.ampsSd, 'noise.ampsSd');
  const tSd = sd(noise.tempSd, 'noise.tempSd');
  return { volts: () => vSd * normal(), amps: () => iSd * normal(), temp: () => tSd * normal() };
}

/** Lowest and highest voltage of the model OCV curve, V. */
export const OCV_EMPTY_V = 3.0;
export const OCV_FULL_V = 4.2;

/**
 * Open-circuit voltage of a cobalt/nickel lithium-ion cell at a state of
 * charge 0..1: 3.0 V empty, 4.2 V full, a steep rise over the first few
 * percent, a gentle middle and a rise towards full. Smooth and strictly
 * increasing; an approximation for demo data [M].
 * V(s) = 3.0 + 0.55·(1 − e^(−s/0.05))/(1 − e^(−20)) + 0.35·s + 0.30·s³.
 */
export function lithiumIonOcv(soc: number): number {
  requireFraction(soc, 'soc');
  return OCV_EMPTY_V + (0.55 * (1 - Math.exp(-soc / 0.05))) / (1 - Math.exp(-20)) + 0.35 * soc + 0.3 * soc ** 3;
}

const clampSoc = (soc: number) => Math.min(1, Math.max(0, soc));

/** First-order thermal response T(t) = T0 + ΔT·(1 − e^(−t/τ)), °C [C]. */
export function firstOrderThermal(tS: number, p: { initialC: number; riseC: number; tauS: number }): number {
  requireNonNegative(tS, 'tS');
  requireFinite(p.initialC, 'initialC');
  requireFinite(p.riseC, 'riseC');
  requirePositive(p.tauS, 'tauS');
  return p.initialC + p.riseC * (1 - Math.exp(-tS / p.tauS));
}

/** A simulated log as plain arrays. */
export interface SimulatedSeries {
  t: number[];
  v: number[];
  i: number[];
  p: number[];
}

export interface DischargeSimulation {
  capacityAh: number;
  /** Constant current, A (give this or powerW). */
  currentA?: number;
  /** Constant power, W (give this or currentA). */
  powerW?: number;
  internalResistanceOhm: number;
  cutoffVolts: number;
  stepS: number;
  /** Starting state of charge, 0..1; default 1. */
  initialSoc?: number;
  noise?: SimulationNoise;
  /** A current pulse for the DC resistance method, logged at a finer step around it. */
  pulse?: DischargePulse;
}

/**
 * A step to a higher current during a discharge, as the DC internal-resistance method does it
 * (REFERENCES §12: 0.2 It, then 1.0 It for 1 s). Samples from leadS before the pulse to leadS after
 * it are logged every stepS instead of the run's step.
 */
export interface DischargePulse {
  /** Start of the pulse, s. */
  atS: number;
  currentA: number;
  durationS: number;
  /** Logging step around the pulse, s; default 0.5 s. */
  stepS?: number;
  /** Finely logged time either side of the pulse, s; default 10 s. */
  leadS?: number;
}

function stepCount(durationGuessS: number, stepS: number): void {
  if (durationGuessS / stepS > MAX_SIMULATED_SAMPLES) {
    throw new RangeError(`stepS (${stepS} s) is too small for this run: it would need more than ${MAX_SIMULATED_SAMPLES} samples.`);
  }
}

/**
 * Constant-current or constant-power discharge of the model cell through its
 * internal resistance (V = OCV(soc) − I·R), sampled every stepS until the
 * terminal voltage reaches cutoffVolts or the cell is empty. An optional
 * pulse steps the current up for a while (a sag during it does not end the run).
 */
export function simulateDischarge(s: DischargeSimulation): { series: SimulatedSeries; endReason: 'cutoff' | 'empty' } {
  const capacityAh = requirePositive(s.capacityAh, 'capacityAh');
  const r = requireNonNegative(s.internalResistanceOhm, 'internalResistanceOhm');
  const cutoff = requirePositive(s.cutoffVolts, 'cutoffVolts');
  const stepS = requirePositive(s.stepS, 'stepS');
  let soc = requireFraction(optionalFinite(s.initialSoc, 'initialSoc') ?? 1, 'initialSoc');
  const currentA = optionalFinite(s.currentA, 'currentA');
  const powerW = optionalFinite(s.powerW, 'powerW');
  if ((currentA === undefined) === (powerW === undefined)) {
    throw new RangeError('Give exactly one of currentA or powerW for the discharge.');
  }
  if (currentA !== undefined) requirePositive(currentA, 'currentA');
  if (powerW !== undefined) requirePositive(powerW, 'powerW');
  const minCurrent = currentA ?? (powerW as number) / OCV_FULL_V;
  stepCount((soc * capacityAh * 3600) / minCurrent, stepS);

  const pulse = checkPulse(s.pulse, stepS);
  const noise = noiseSource(s.noise);
  const series: SimulatedSeries = { t: [], v: [], i: [], p: [] };
  // Sample times: k·stepS, with the pulse window [from, to] logged every pulse.stepS (m counts its samples, −1 outside).
  let k = 0;
  let m = pulse !== null && pulse.from <= 0 ? 0 : -1;
  let tS = 0;
  const nextTime = (): number => {
    if (pulse && m >= 0) {
      const inWindow = pulse.from + (m + 1) * pulse.stepS;
      if (inWindow <= pulse.to + 1e-9) {
        m++;
        return inWindow;
      }
      // Leaving the window: back to the run's own grid.
      m = -1;
      while (k * stepS <= tS + 1e-9) k++;
      return k * stepS;
    }
    k++;
    if (pulse && tS < pulse.from - 1e-9 && k * stepS >= pulse.from - 1e-9) {
      m = 0;
      return pulse.from;
    }
    return k * stepS;
  };
  for (;;) {
    const inPulse = pulse !== null && tS >= pulse.atS && tS < pulse.atS + pulse.durationS;
    const ocv = lithiumIonOcv(clampSoc(soc));
    let current: number;
    if (inPulse) {
      current = pulse.currentA;
    } else if (currentA !== undefined) {
      current = currentA;
    } else {
      const P = powerW as number;
      if (r === 0) {
        current = P / ocv;
      } else {
        const disc = ocv * ocv - 4 * r * P;
        // Past the maximum-power point the cell cannot deliver P: treat as cut-off.
        current = disc >= 0 ? (ocv - Math.sqrt(disc)) / (2 * r) : ocv / (2 * r);
      }
    }
    const volts = ocv - current * r;
    const iLogged = current + noise.amps();
    const vLogged = volts + noise.volts();
    series.t.push(tS);
    series.v.push(vLogged);
    series.i.push(iLogged);
    series.p.push(vLogged * iLogged);
    if (volts <= cutoff && !inPulse) return { series, endReason: 'cutoff' };
    if (soc <= 0) return { series, endReason: 'empty' };
    const next = nextTime();
    soc -= (current * (pulse ? next - tS : stepS)) / 3600 / capacityAh;
    tS = next;
  }
}

function checkPulse(p: DischargePulse | undefined, runStepS: number): (Required<DischargePulse> & { from: number; to: number }) | null {
  if (p === undefined) return null;
  const atS = requireNonNegative(p.atS, 'pulse.atS');
  const currentA = requirePositive(p.currentA, 'pulse.currentA');
  const durationS = requirePositive(p.durationS, 'pulse.durationS');
  const stepS = requirePositive(optionalFinite(p.stepS, 'pulse.stepS') ?? 0.5, 'pulse.stepS');
  const leadS = requireNonNegative(optionalFinite(p.leadS, 'pulse.leadS') ?? 10, 'pulse.leadS');
  if (stepS > runStepS) throw new RangeError(`pulse.stepS (${stepS} s) must not be longer than the run's stepS (${runStepS} s).`);
  const from = Math.max(0, atS - leadS);
  return { atS, currentA, durationS, stepS, leadS, from, to: atS + durationS + leadS };
}

export interface ChargeSimulation {
  capacityAh: number;
  ccCurrentA: number;
  /** Charge voltage, V; at most the model's full voltage (4.2 V). */
  cvVolts: number;
  /** The charge stops when the current falls to this value, A. */
  terminationA: number;
  internalResistanceOhm: number;
  stepS: number;
  /** Starting state of charge, 0..1; default 0. */
  initialSoc?: number;
  noise?: SimulationNoise;
}

/**
 * CC-CV charge of the model cell: constant current while OCV + I·R is below
 * cvVolts, then I = (cvVolts − OCV)/R until I falls to terminationA.
 * transitionIndex is the first sample of the CV phase.
 */
export function simulateCharge(s: ChargeSimulation): { series: SimulatedSeries; transitionIndex: number | null } {
  const capacityAh = requirePositive(s.capacityAh, 'capacityAh');
  const icc = requirePositive(s.ccCurrentA, 'ccCurrentA');
  const cv = requirePositive(s.cvVolts, 'cvVolts');
  if (cv > OCV_FULL_V) {
    throw new RangeError(`cvVolts (${cv} V) must not exceed the model cell's full-charge voltage of ${OCV_FULL_V} V.`);
  }
  const term = requirePositive(s.terminationA, 'terminationA');
  if (term >= icc) throw new RangeError(`terminationA (${term} A) must be below ccCurrentA (${icc} A).`);
  const r = requirePositive(s.internalResistanceOhm, 'internalResistanceOhm');
  const stepS = requirePositive(s.stepS, 'stepS');
  let soc = requireFraction(optionalFinite(s.initialSoc, 'initialSoc') ?? 0, 'initialSoc');
  if (lithiumIonOcv(soc) >= cv) {
    throw new RangeError(`initialSoc (${soc}) already puts the cell at or above cvVolts (${cv} V); nothing to charge.`);
  }
  // CC time plus a CV taper of up to ln(icc/term) time constants of R·C.
  stepCount((((1 - soc) * capacityAh) / term) * 3600, stepS);

  const noise = noiseSource(s.noise);
  const series: SimulatedSeries = { t: [], v: [], i: [], p: [] };
  let transitionIndex: number | null = null;
  for (let k = 0; ; k++) {
    const ocv = lithiumIonOcv(clampSoc(soc));
    let current = icc;
    let volts = ocv + icc * r;
    if (volts >= cv) {
      if (transitionIndex === null) transitionIndex = k;
      current = (cv - ocv) / r;
      volts = cv;
    }
    const iLogged = current + noise.amps();
    const vLogged = volts + noise.volts();
    series.t.push(k * stepS);
    series.v.push(vLogged);
    series.i.push(iLogged);
    series.p.push(vLogged * iLogged);
    if (current <= term) return { series, transitionIndex };
    soc += (current * stepS) / 3600 / capacityAh;
  }
}

export interface HeaterSimulation {
  watts: number;
  tauS: number;
  /** Thermal resistance surface-to-ambient, K/W. */
  rthKPerW: number;
  ambientC: number;
  durationS: number;
  stepS: number;
  noise?: SimulationNoise;
}

/** Surface temperature of a heater at constant power: ambient + P·Rth·(1 − e^(−t/τ)), logged with t, temp and p. */
export function simulateHeater(s: HeaterSimulation): { series: { t: number[]; temp: number[]; p: number[] } } {
  const watts = requireNonNegative(s.watts, 'watts');
  const tauS = requirePositive(s.tauS, 'tauS');
  const rth = requirePositive(s.rthKPerW, 'rthKPerW');
  const ambientC = requireFinite(s.ambientC, 'ambientC');
  const durationS = requirePositive(s.durationS, 'durationS');
  const stepS = requirePositive(s.stepS, 'stepS');
  stepCount(durationS, stepS);
  const noise = noiseSource(s.noise);
  const series = { t: [] as number[], temp: [] as number[], p: [] as number[] };
  const samples = Math.floor(durationS / stepS + 1e-9);
  for (let k = 0; k <= samples; k++) {
    const tS = k * stepS;
    series.t.push(tS);
    series.temp.push(firstOrderThermal(tS, { initialC: ambientC, riseC: watts * rth, tauS }) + noise.temp());
    series.p.push(watts);
  }
  return { series };
}

/** How a figure is obtained, for the UI: the formula and the source label (REFERENCES.md labels). */
export interface FormulaEntry {
  formula: string;
  source: string;
}

/**
 * Catalogue of every figure family and bench-tool result. Teardown figures keyed per record
 * (load.<id>.power, trace.<id>.rating, heater.<id>.surfaceRise…) use the entry of their family
 * (load.power, trace.rating, heater.surfaceRise…).
 */
const CATALOGUE = {
  // electrical
  'electrical.current': { formula: 'I = V / R', source: "Ohm's law [C]" },
  'electrical.power': { formula: 'P = V² / R', source: "Joule's law [C]" },
  'electrical.series': { formula: 'R_eq = R₁ + R₂ + … + Rₙ', source: 'Series combination [C]' },
  'electrical.parallel': { formula: '1 / R_eq = 1/R₁ + 1/R₂ + … + 1/Rₙ', source: 'Parallel combination [C]' },
  'electrical.pwmAveragePower': { formula: 'P_avg = D · P_peak', source: 'Ideal PWM of a resistive load [C]' },
  'electrical.dutyForTargetPower': { formula: 'D = P_target / P_peak', source: 'Ideal PWM of a resistive load [C]' },
  'electrical.rmsVoltage': { formula: 'V_rms = V · √D', source: 'Ideal PWM square wave [C]' },
  'electrical.powerFromCurrent': { formula: 'P = I² · R', source: "Joule's law [C]" },
  'electrical.voltageDrop': { formula: 'V = I · R', source: "Ohm's law [C]" },
  'load.power': { formula: 'P = V² / R_eq, R_eq = n·R (series) or R/n (parallel)', source: "Joule's law [C]" },
  'load.elementPower': { formula: 'P_e = V_e² / R_e, V_e = V/n (series) or V (parallel)', source: "Joule's law [C]" },
  'load.current': {
    formula: 'I_pack = Σ I_load (direct) + Σ P_load / (η · V_in) (through a converter)',
    source: "Ohm's law; converter power balance [C]",
  },
  'load.averagePower': { formula: 'P_avg = Σ D · P_load', source: 'Ideal PWM [C]' },
  'load.dischargePower': { formula: 'P_avg = mean(V²) / R_eq over the run', source: '[C] a fixed resistance on a falling voltage' },
  'mode.power': { formula: 'P = Σ D_k · P_k over the loads active in the mode', source: 'Ideal PWM [C]' },
  'mode.packPower': { formula: 'P_pack = Σ D_k · P_k / η_k + I_q · V_pack', source: 'Power balance through the converters [C]' },
  'mode.current': { formula: 'I = Σ D_k · I_pack,k + I_q', source: "Ohm's law; converter power balance [C]" },
  'mode.standby': { formula: 'months = C / (s · C + I_q · 730 h)', source: '[C]; Li-ion self-discharge 2–3 %/month [CP]' },
  'pack.terminalVolts': { formula: 'U = U_oc − I · R_pack, R_pack = R_cell · S / P', source: '[M: IEC 61960-3] DC internal resistance; [C]' },
  'pack.cellHeat': { formula: 'P = mean(i²) · R_pack', source: "Joule's law [C]" },
  'pack.loadedPower': { formula: 'I = U_oc / (R_load + R_pack), P = Σ D_k · U² / R_k', source: "Ohm's law with a source resistance [C]" },
  'pack.shipping': {
    formula: 'UN 3480 (alone, PI 965) or UN 3481 (packed with PI 966, contained in PI 967); Section II when cells ≤ 20 Wh and battery ≤ 100 Wh',
    source: '[S: IATA DGR, Section II of PI 965–970; M for edition detail]',
  },
  'charge.cRate': { formula: 'n = I_charge / C_rated', source: '[S] C-rate definition' },
  'charge.inputCurrent': { formula: 'I_in = V_pack · I_charge / (η · V_bus)', source: '[C]; port limits [S: USB 2.0 §7.2.1, BC 1.2, USB Type-C]' },
  'claim.outputWatts': { formula: 'P_computed / P_claimed · 100 %', source: '[C]' },
  // battery
  'pack.energy': { formula: 'E = V_nom · Ah · S · P', source: "[S: cell makers' application guides] Wh = V_nom · Ah" },
  'pack.transportClass': {
    formula: 'E ≤ 100 Wh; 100 Wh < E ≤ 160 Wh; E > 160 Wh ("not exceeding")',
    source: '[S: IATA DGR / ICAO TI] lithium-ion watt-hour limits',
  },
  'pack.specificEnergy': { formula: 'e = E / m', source: '[C]; commercial Li-ion cells 100–265 Wh/kg [S: encyclopedic data]' },
  'pack.cRate': { formula: 'n = I / C_rated', source: '[S] C-rate definition' },
  'pack.current': { formula: 'I = P / (η · V_pack), V_pack = S · V_cell', source: 'Power balance at the pack [C]' },
  'pack.loadFromCurrent': { formula: 'P = I · V_pack, V_pack = S · V_cell', source: 'Power balance at the pack [C]' },
  'runtime.hours': { formula: 't = E · η · u / P = E_pack / Σ (P_load · D / η)', source: 'Energy balance [C]' },
  'battery.chargeTime': {
    formula: 't = f·C / I + τ · ln(I / I_t), τ = (1 − f)·C / (I − I_t); f = 0.8, I_t = C/20',
    source: 'Rough CC-CV model [CP]; termination C/10–C/30 [S, cell-specific]',
  },
  'charge.timeHours': {
    formula: 't = f·C / I + τ · ln(I / I_t), τ = (1 − f)·C / (I − I_t); f = 0.8, I_t = C/20',
    source: 'Rough CC-CV model [CP]; termination C/10–C/30 [S, cell-specific]',
  },
  'battery.plausibility': { formula: 'E_claimed / m ≤ e_max(chemistry)', source: '[CP] flag Li-ion cells claiming more than about 300 Wh/kg' },
  'capacity.measuredVsLabel': {
    formula: 'E_measured / E_label · 100 %, E_label = Wh on the label or Ah_label · V_cell',
    source: '[M: IEC 61960-3] delivered capacity must reach the rated value; labels quote mAh at the cell voltage [CP]',
  },
  // converters
  'converter.buckDuty': { formula: 'D = V_out / (V_in · η)', source: '[S: Erickson & Maksimović, Fundamentals of Power Electronics]' },
  'converter.boostDuty': { formula: 'D = 1 − V_in · η / V_out', source: "[S] ideal; [M: semiconductor makers' application notes] with losses" },
  'converter.loss': { formula: 'P_loss = P_out · (1/η − 1)', source: 'Power balance [C]' },
  'powerbank.outputAh': { formula: 'Ah_out = V_cell · Ah_rated · η / V_out', source: '[CP] power-bank rating practice' },
  'powerbank.deliveredVsLabel': { formula: 'E_delivered / E_label · 100 %', source: '[CP] η typically 0.80–0.90 at 5 V' },
  // traces
  'trace.resistance': { formula: 'R = ρ·L / (w·t) · [1 + α·(T − 20 °C)]', source: '[S: IEC 60028] IACS ρ = 1.7241e-8 Ω·m, α = 0.00393 /K' },
  'trace.rating': { formula: 'I = k · ΔT^0.44 · (w·t)^0.725, k = 0.048 external / 0.024 internal, mil²', source: '[S: IPC-2221 curve fit]' },
  'trace.minWidth': { formula: 'w = (I / (k · ΔT^0.44))^(1/0.725) / t, mil', source: '[S: IPC-2221 curve fit]' },
  'heater.powerDensity': { formula: 'p = P / A', source: '[C]' },
  'trace.sheetResistance': { formula: 'R_□ = ρ / t', source: '[S: IEC 60028] IACS ρ = 1.7241e-8 Ω·m; [C]' },
  // thermal
  'heater.surfaceRise': {
    formula: 'D · P = h · A · ΔT + ε · σ · A · ((T_a + ΔT)⁴ − T_a⁴), solved for ΔT',
    source: 'Newton cooling and exact radiative exchange, steady state [C]; h 2–25 W/m²K free convection [S: Çengel]; ε [S: handbook tables, Incropera Table A.11]',
  },
  'heater.surfaceTemperature': {
    formula: 'T_s = T_a + ΔT, D · P = h · A · ΔT + ε · σ · A · (T_s⁴ − T_a⁴)',
    source: 'Newton cooling and exact radiative exchange, steady state [C]; h 2–25 W/m²K [S: Çengel]; ε [S: handbook tables]',
  },
  'heater.surfaceMeasured': { formula: 'T_s measured at the bench (thermal run peak or a reading)', source: 'Measured at the bench (the peak of a thermal run or a reading) [CP: a measurement beats an estimate]' },
  'heater.powerHot': { formula: 'P = V² / R(T), R(T) = R₂₀ · (1 + α · (T − 20 °C)), T from the surface estimate', source: '[S: CRC] α copper 0.00393 /K; [C]' },
  'heater.timeConstant': { formula: 'τ = m · c / (h_eff · A)', source: '[S: Incropera ch. 5] lumped capacitance, Bi < 0.1; c [S: handbook tables]' },
  'heater.timeToThreshold': { formula: 't = −τ · ln(1 − (T_burn − T_a) / ΔT_ss)', source: '[S: Incropera ch. 5] first-order response; [C]' },
  'heater.dutyForTarget': { formula: 'D = [h · A · ΔT + ε · σ · A · (T_t⁴ − T_a⁴)] / P_full', source: 'Steady-state energy balance [C]' },
  'heater.touchMargin': {
    formula: 'margin = T_burn(material, contact time) − (T_ambient + ΔT)',
    source: '[M: ISO 13732-1] 1 min: metal 51, ceramics/glass 56, plastics and wood 60 °C; 10 min 48 °C, 8 h 43 °C; [S: ECMA-287] shorter contact',
  },
  'thermal.burnThreshold': {
    formula: 'T_burn(material, next longer listed contact time)',
    source: '[M: ISO 13732-1]; [S: ECMA-287]',
  },
  'thermal.dutyForRise': { formula: 'D = ΔT · h · A / P_peak', source: 'Newton cooling, steady state [C]' },
  'thermal.surfaceRise': { formula: 'ΔT = P / (h · A)', source: 'Newton cooling, steady state [C]; h 2–25 W/m²K free convection [S: Çengel]' },
  // bench runs
  'run.integration': {
    formula: 'Ah = Σ ½(I_k + I_k+1)·Δt / 3600; Wh = Σ ½(V_k·I_k + V_k+1·I_k+1)·Δt / 3600',
    source: '[S: composite trapezoidal rule, numpy docs]; V·I per sample, never mean V × mean I [C]',
  },
  'run.averageVolts': { formula: 'V_avg = Wh / Ah (charge-weighted); ∫V dt / duration (time-weighted)', source: '[C]' },
  'run.cutoff': {
    formula: 'first sample with V ≤ V_cutoff, else last sample before I < 2 % of the peak',
    source: '[M: IEC 61960-3] discharge to the end voltage the maker specifies',
  },
  'run.chargePhases': {
    formula: 'CC until V reaches the CV plateau and I starts to fall; CV until I ≤ f · I_CC (f = 0.05)',
    source: "[S: cell makers' application guides] CC-CV charging; termination C/10–C/30 [S, cell-specific]",
  },
  'run.steadyState': {
    formula: '|slope of T over a sliding window| ≤ 0.1 °C/min held for the window; T_ss = median of the last window',
    source: 'Sliding-window plateau criterion [C]',
  },
  // cost
  'cost.unitPrice': { formula: 'price of the break with the largest minQty ≤ quantity', source: 'Quantity price breaks [CP]' },
  'cost.currency': { formula: 'amount_B = amount_A / rate_A × rate_B (rates per 1 unit of the base)', source: '[S: ECB reference rates] cross rate through the base; round only at the end [CP]' },
  'cost.rollUp': {
    formula: 'Σ qty × unit price × (1 + attrition) + assembly + labour + test + packaging, ÷ yield, + overhead',
    source: 'Should-cost build-up [CP]; attrition and yield rules of thumb [CP]',
  },
  'cost.landed': {
    formula: 'CIF = FOB + freight + insurance; duty = d · CIF; VAT = v · (CIF + duty); landed = CIF + duty + VAT + brokerage',
    source: '[S: customs-valuation guides] CIF duty basis',
  },
  'cost.margin': { formula: 'margin = markup / (1 + markup); markup = margin / (1 − margin)', source: '[S: marketing dictionaries] keystone = 100 % markup = 50 % margin; [C]' },
  'cost.impliedMargin': {
    formula: 'net = retail / (1 + v_sales tax) · (1 − m_retail) · (1 − m_platform); margin = net − landed cost (incomplete while a BOM line is unpriced)',
    source: 'Price build-down [CP]; sales tax in the retail price, net = gross / (1 + v) [CP]',
  },
  // comparison
  'compare.whPerCurrency': { formula: 'Wh / retail price', source: 'Normalised metric [C]' },
  'compare.pareto': { formula: 'points with no other point of lower-or-equal cost and higher-or-equal benefit (one strictly)', source: 'Pareto dominance [C]' },
  'compare.weightedScore': {
    formula: 'score = 100 · Σ w_k · n_k / Σ w_k, n_k = min-max normalised metric (1 = best)',
    source: 'Weighted sum of min-max normalised metrics [C]',
  },
  // markings
  'marking.resistor': { formula: 'digits × 10^last digit; R = decimal point', source: '[S: instrument manual, distributor page]' },
  'marking.eia96': { formula: 'E96 value at index nn × letter multiplier', source: '[S: EIA-96 decoders agree]' },
  'marking.letterCode': { formula: 'R, K or M is the decimal point and the multiplier (× 1, × 10³, × 10⁶)', source: '[S: IEC 60062] letter-and-digit code' },
  'marking.jumper': { formula: '0, 00, 000 or 0000 = 0 Ω link', source: '[M] jumper marking' },
  'marking.capacitor': { formula: 'two digits × 10^third digit pF (8: ×0.01, 9: ×0.1)', source: '[S]; [M] for 8 and 9' },
  'marking.capacitorLetter': { formula: 'p, n, u (µ) or R is the decimal point and the unit (pF, nF, µF; R = pF)', source: '[S: IEC 60062] letter-and-digit code; [CP]' },
  'marking.tolerance': { formula: 'letter → ± share of the value (pF under 10 pF for B, C, D, F)', source: '[S: IEC 60062] B C D F G J K M N Z, capacitor P; [M] W L, resistor P' },
  'marking.colourBands': { formula: 'digits × 10^multiplier, ± tolerance', source: '[S: IEC 60062:2016 summary pages]' },
  'marking.nearestPreferred': { formula: 'v minimising |ln(x / v)| over the series', source: '[S: IEC 60063:2015] lists; log rule [C]' },
} as const satisfies Record<string, FormulaEntry>;

export type FormulaKey = keyof typeof CATALOGUE;

/** Formula and source of every figure family, for the API and UI to show beside a value. */
export const FORMULAS: Readonly<Record<string, FormulaEntry>> = CATALOGUE;

/** The catalogue entry of a known figure family. */
export function formulaOf(key: FormulaKey): FormulaEntry {
  return CATALOGUE[key];
}

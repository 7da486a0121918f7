/** How a figure is obtained, for the UI: the formula and the source label (REFERENCES.md labels). */
export interface FormulaEntry {
  formula: string;
  source: string;
}

/** One catalogue entry. */
const e = (formula: string, source: string): FormulaEntry => ({ formula, source });

const JOULE = "Joule's law [C]";
const OHM = "Ohm's law [C]";
/** The charge-time model, shared by the bench tool (battery.chargeTime) and the teardown figure (charge.timeHours). */
const CC_CV_CHARGE = e('t = f·C / I + τ · ln(I / I_t), τ = (1 − f)·C / (I − I_t); f = 0.8, I_t = C/20', 'Rough CC-CV model [CP]; termination C/10–C/30 [S, cell-specific]');

/**
 * Catalogue of every figure family and bench-tool result. Teardown figures keyed per record
 * (load.<id>.power, trace.<id>.rating, heater.<id>.surfaceRise…) use the entry of their family
 * (load.power, trace.rating, heater.surfaceRise…).
 */
const CATALOGUE = {
  // electrical
  'electrical.current': e('I = V / R', OHM),
  'electrical.power': e('P = V² / R', JOULE),
  'electrical.series': e('R_eq = R₁ + R₂ + … + Rₙ', 'Series combination [C]'),
  'electrical.parallel': e('1 / R_eq = 1/R₁ + 1/R₂ + … + 1/Rₙ', 'Parallel combination [C]'),
  'electrical.pwmAveragePower': e('P_avg = D · P_peak', 'Ideal PWM of a resistive load [C]'),
  'electrical.dutyForTargetPower': e('D = P_target / P_peak', 'Ideal PWM of a resistive load [C]'),
  'electrical.rmsVoltage': e('V_rms = V · √D', 'Ideal PWM square wave [C]'),
  'electrical.powerFromCurrent': e('P = I² · R', JOULE),
  'electrical.voltageDrop': e('V = I · R', OHM),
  'load.power': e('P = V² / R_eq, R_eq = n·R (series) or R/n (parallel)', JOULE),
  'load.elementPower': e('P_e = V_e² / R_e, V_e = V/n (series) or V (parallel)', JOULE),
  'load.current': e('I_pack = Σ I_load (direct) + Σ P_load / (η · V_in) (through a converter)', "Ohm's law; converter power balance [C]"),
  'load.averagePower': e('P_avg = Σ D · P_load', 'Ideal PWM [C]'),
  'load.dischargePower': e('P_avg = mean(V²) / R_eq over the run', '[C] a fixed resistance on a falling voltage'),
  'mode.power': e('P = Σ D_k · P_k over the loads active in the mode', 'Ideal PWM [C]'),
  'mode.packPower': e('P_pack = Σ D_k · P_k / η_k + I_q · V_pack', 'Power balance through the converters [C]'),
  'mode.current': e('I = Σ D_k · I_pack,k + I_q', "Ohm's law; converter power balance [C]"),
  'mode.standby': e('months = C / (s · C + I_q · 730 h)', '[C]; Li-ion self-discharge 2–3 %/month [CP]'),
  'pack.terminalVolts': e('U = U_oc − I · R_pack, R_pack = R_cell · S / P', '[M: IEC 61960-3] DC internal resistance; [C]'),
  'pack.cellHeat': e('P = mean(i²) · R_pack', JOULE),
  'pack.loadedPower': e('I = U_oc / (R_load + R_pack), P = Σ D_k · U² / R_k', "Ohm's law with a source resistance [C]"),
  'pack.shipping': e(
    'UN 3480 (alone, PI 965) or UN 3481 (packed with PI 966, contained in PI 967); Section II when cells ≤ 20 Wh and battery ≤ 100 Wh',
    '[S: IATA DGR, Section II of PI 965–970; M for edition detail]',
  ),
  'charge.cRate': e('n = I_charge / C_rated', '[S] C-rate definition'),
  'charge.inputCurrent': e('I_in = V_pack · I_charge / (η · V_bus)', '[C]; port limits [S: USB 2.0 §7.2.1, BC 1.2, USB Type-C]'),
  'claim.outputWatts': e('P_computed / P_claimed · 100 %', '[C]'),
  // battery
  'pack.energy': e('E = V_nom · Ah · S · P', "[S: cell makers' application guides] Wh = V_nom · Ah"),
  'pack.transportClass': e('E ≤ 100 Wh; 100 Wh < E ≤ 160 Wh; E > 160 Wh ("not exceeding")', '[S: IATA DGR / ICAO TI] lithium-ion watt-hour limits'),
  'pack.specificEnergy': e('e = E / m', '[C]; commercial Li-ion cells 100–265 Wh/kg [S: encyclopedic data]'),
  'pack.cRate': e('n = I / C_rated', '[S] C-rate definition'),
  'pack.current': e('I = P / (η · V_pack), V_pack = S · V_cell', 'Power balance at the pack [C]'),
  'pack.loadFromCurrent': e('P = I · V_pack, V_pack = S · V_cell', 'Power balance at the pack [C]'),
  'runtime.hours': e('t = E · η · u / P = E_pack / Σ (P_load · D / η)', 'Energy balance [C]'),
  'battery.chargeTime': CC_CV_CHARGE,
  'charge.timeHours': CC_CV_CHARGE,
  'battery.plausibility': e('E_claimed / m ≤ e_max(chemistry)', '[CP] flag Li-ion cells claiming more than about 300 Wh/kg'),
  'capacity.measuredVsLabel': e(
    'E_measured / E_label · 100 %, E_label = Wh on the label or Ah_label · V_cell',
    '[M: IEC 61960-3] delivered capacity must reach the rated value; labels quote mAh at the cell voltage [CP]',
  ),
  // converters
  'converter.buckDuty': e('D = V_out / (V_in · η)', '[S: Erickson & Maksimović, Fundamentals of Power Electronics]'),
  'converter.boostDuty': e('D = 1 − V_in · η / V_out', "[S] ideal; [M: semiconductor makers' application notes] with losses"),
  'converter.loss': e('P_loss = P_out · (1/η − 1)', 'Power balance [C]'),
  'powerbank.outputAh': e('Ah_out = V_cell · Ah_rated · η / V_out', '[CP] power-bank rating practice'),
  'powerbank.deliveredVsLabel': e('E_delivered / E_label · 100 %', '[CP] η typically 0.80–0.90 at 5 V'),
  // traces
  'trace.resistance': e('R = ρ·L / (w·t) · [1 + α·(T − 20 °C)]', '[S: IEC 60028] IACS ρ = 1.7241e-8 Ω·m, α = 0.00393 /K'),
  'trace.rating': e('I = k · ΔT^0.44 · (w·t)^0.725, k = 0.048 external / 0.024 internal, mil²', '[S: IPC-2221 curve fit]'),
  'trace.minWidth': e('w = (I / (k · ΔT^0.44))^(1/0.725) / t, mil', '[S: IPC-2221 curve fit]'),
  'heater.powerDensity': e('p = P / A', '[C]'),
  'trace.sheetResistance': e('R_□ = ρ / t', '[S: IEC 60028] IACS ρ = 1.7241e-8 Ω·m; [C]'),
  // thermal
  'heater.surfaceRise': e(
    'D · P = h · A · ΔT + ε · σ · A · ((T_a + ΔT)⁴ − T_a⁴), solved for ΔT',
    'Newton cooling and exact radiative exchange, steady state [C]; h 2–25 W/m²K free convection [S: Çengel]; ε [S: handbook tables, Incropera Table A.11]',
  ),
  'heater.surfaceTemperature': e(
    'T_s = T_a + ΔT, D · P = h · A · ΔT + ε · σ · A · (T_s⁴ − T_a⁴)',
    'Newton cooling and exact radiative exchange, steady state [C]; h 2–25 W/m²K [S: Çengel]; ε [S: handbook tables]',
  ),
  'heater.surfaceMeasured': e('T_s measured at the bench (thermal run peak or a reading)', 'Measured at the bench (the peak of a thermal run or a reading) [CP: a measurement beats an estimate]'),
  'heater.powerHot': e('P = V² / R(T), R(T) = R₂₀ · (1 + α · (T − 20 °C)), T from the surface estimate', '[S: CRC] α copper 0.00393 /K; [C]'),
  'heater.timeConstant': e('τ = m · c / (h_eff · A)', '[S: Incropera ch. 5] lumped capacitance, Bi < 0.1; c [S: handbook tables]'),
  'heater.timeToThreshold': e('t = −τ · ln(1 − (T_burn − T_a) / ΔT_ss)', '[S: Incropera ch. 5] first-order response; [C]'),
  'heater.dutyForTarget': e('D = [h · A · ΔT + ε · σ · A · (T_t⁴ − T_a⁴)] / P_full', 'Steady-state energy balance [C]'),
  'heater.touchMargin': e(
    'margin = T_burn(material, contact time) − (T_ambient + ΔT)',
    '[M: ISO 13732-1] 1 min: metal 51, ceramics/glass 56, plastics and wood 60 °C; 10 min 48 °C, 8 h 43 °C; [S: ECMA-287] shorter contact',
  ),
  'thermal.burnThreshold': e('T_burn(material, next longer listed contact time)', '[M: ISO 13732-1]; [S: ECMA-287]'),
  'thermal.dutyForRise': e('D = ΔT · h · A / P_peak', 'Newton cooling, steady state [C]'),
  'thermal.surfaceRise': e('ΔT = P / (h · A)', 'Newton cooling, steady state [C]; h 2–25 W/m²K free convection [S: Çengel]'),
  // bench runs
  'run.integration': e('Ah = Σ ½(I_k + I_k+1)·Δt / 3600; Wh = Σ ½(V_k·I_k + V_k+1·I_k+1)·Δt / 3600', '[S: composite trapezoidal rule, numpy docs]; V·I per sample, never mean V × mean I [C]'),
  'run.averageVolts': e('V_avg = Wh / Ah (charge-weighted); ∫V dt / duration (time-weighted)', '[C]'),
  'run.cutoff': e('first sample with V ≤ V_cutoff, else last sample before I < 2 % of the peak', '[M: IEC 61960-3] discharge to the end voltage the maker specifies'),
  'run.chargePhases': e(
    'CC until V reaches the CV plateau and I starts to fall; CV until I ≤ f · I_CC (f = 0.05)',
    "[S: cell makers' application guides] CC-CV charging; termination C/10–C/30 [S, cell-specific]",
  ),
  'run.steadyState': e('|slope of T over a sliding window| ≤ 0.1 °C/min held for the window; T_ss = median of the last window', 'Sliding-window plateau criterion [C]'),
  // cost
  'cost.unitPrice': e('price of the break with the largest minQty ≤ quantity', 'Quantity price breaks [CP]'),
  'cost.currency': e('amount_B = amount_A / rate_A × rate_B (rates per 1 unit of the base)', '[S: ECB reference rates] cross rate through the base; round only at the end [CP]'),
  'cost.rollUp': e('Σ qty × unit price × (1 + attrition) + assembly + labour + test + packaging, ÷ yield, + overhead', 'Should-cost build-up [CP]; attrition and yield rules of thumb [CP]'),
  'cost.landed': e('CIF = FOB + freight + insurance; duty = d · CIF; VAT = v · (CIF + duty); landed = CIF + duty + VAT + brokerage', '[S: customs-valuation guides] CIF duty basis'),
  'cost.margin': e('margin = markup / (1 + markup); markup = margin / (1 − margin)', '[S: marketing dictionaries] keystone = 100 % markup = 50 % margin; [C]'),
  'cost.impliedMargin': e(
    'net = retail / (1 + v_sales tax) · (1 − m_retail) · (1 − m_platform); margin = net − landed cost (incomplete while a BOM line is unpriced)',
    'Price build-down [CP]; sales tax in the retail price, net = gross / (1 + v) [CP]',
  ),
  // comparison
  'compare.whPerCurrency': e('Wh / retail price', 'Normalised metric [C]'),
  'compare.pareto': e('points with no other point of lower-or-equal cost and higher-or-equal benefit (one strictly)', 'Pareto dominance [C]'),
  'compare.weightedScore': e('score = 100 · Σ w_k · n_k / Σ w_k, n_k = min-max normalised metric (1 = best)', 'Weighted sum of min-max normalised metrics [C]'),
  // markings
  'marking.resistor': e('digits × 10^last digit; R = decimal point', '[S: instrument manual, distributor page]'),
  'marking.eia96': e('E96 value at index nn × letter multiplier', '[S: EIA-96 decoders agree]'),
  'marking.letterCode': e('R, K or M is the decimal point and the multiplier (× 1, × 10³, × 10⁶)', '[S: IEC 60062] letter-and-digit code'),
  'marking.jumper': e('0, 00, 000 or 0000 = 0 Ω link', '[M] jumper marking'),
  'marking.capacitor': e('two digits × 10^third digit pF (8: ×0.01, 9: ×0.1)', '[S]; [M] for 8 and 9'),
  'marking.capacitorLetter': e('p, n, u (µ) or R is the decimal point and the unit (pF, nF, µF; R = pF)', '[S: IEC 60062] letter-and-digit code; [CP]'),
  'marking.tolerance': e('letter → ± share of the value (pF under 10 pF for B, C, D, F)', '[S: IEC 60062] B C D F G J K M N Z, capacitor P; [M] W L, resistor P'),
  'marking.colourBands': e('digits × 10^multiplier, ± tolerance', '[S: IEC 60062:2016 summary pages]'),
  'marking.nearestPreferred': e('v minimising |ln(x / v)| over the series', '[S: IEC 60063:2015] lists; log rule [C]'),
} satisfies Record<string, FormulaEntry>;

export type FormulaKey = keyof typeof CATALOGUE;

/** Formula and source of every figure family, for the API and UI to show beside a value. */
export const FORMULAS: Readonly<Record<string, FormulaEntry>> = CATALOGUE;

/** The catalogue entry of a known figure family. */
export function formulaOf(key: FormulaKey): FormulaEntry {
  return CATALOGUE[key];
}

// The charge side (charge time, charge C-rate, what the USB port must supply) and the power-bank
// output (capacity at 5 V with the measured or assumed efficiency, energy delivered against the label).
import { CELL_VOLTAGES, cRate, chargeTimeEstimate } from '../battery/index';
import { powerBankOutputAh, usbChargeInput, USB_PORT_LEVELS } from '../converters/index';
import { figure, inp, num } from './build';
import type { FigureContext } from './context';
import { labelEnergy } from './capacity';
import type { LoadSet } from './loads';

export const isUsbVolts = (v: number) => v >= 4.75 && v <= 5.25;

export function powerBankFigures(ctx: FigureContext, loads: LoadSet): void {
  const { pack } = ctx;
  const usbOut = [...loads.converters.values()].find((c) => c.c.role === 'output' && isUsbVolts(c.c.vout));
  if (!pack || !usbOut) return;
  const run = ctx.input.powerBankRun;
  const runUsable = run !== undefined && run.efficiency > 0 && run.efficiency <= 1;
  const eta = runUsable ? run.efficiency : usbOut.eta;
  const etaNote = runUsable
    ? `Efficiency ${num(run.efficiency)} measured in the ${run.basis}.`
    : run
      ? `The ${run.basis} gives an efficiency of ${num(run.efficiency)}, which is not possible (above 1): not used; ${usbOut.note ?? `converter efficiency ${usbOut.eta}`}.`
      : (usbOut.note ?? `Efficiency ${usbOut.eta} of the output converter.`);
  ctx.figures.push(
    figure({
      key: 'powerbank.outputAh',
      label: `Capacity at the ${num(usbOut.c.vout)} V output`,
      value: powerBankOutputAh({ energyWh: pack.energyWh, outputVolts: usbOut.c.vout, efficiency: eta }),
      unit: 'Ah',
      family: 'powerbank.outputAh',
      inputs: [
        inp('packWh', 'Pack energy', pack.energyWh, 'Wh'),
        inp('outputVolts', 'Output voltage', usbOut.c.vout, 'V'),
        inp('efficiency', runUsable ? 'Efficiency (measured in a bench run)' : 'Converter efficiency', eta),
      ],
      assumptions: ['Rated capacity is quoted at cell voltage; the output figure is what reaches the USB port.', etaNote],
      warnings: run && !runUsable ? [`The power-bank run's efficiency ${num(run.efficiency)} is above 1: check the run's columns and the cell energy it was set against.`] : [],
      implausible: run !== undefined && !runUsable,
    }),
  );
  if (run) {
    const label = labelEnergy(ctx);
    if (label) {
      const share = run.deliveredWh / label.wh;
      ctx.figures.push(
        figure({
          key: 'powerbank.deliveredVsLabel',
          label: `Energy delivered at the output against the label`,
          value: share * 100,
          unit: '%',
          family: 'powerbank.deliveredVsLabel',
          inputs: [inp('deliveredWh', 'Delivered at the output', run.deliveredWh, 'Wh'), inp('labelWh', 'Label energy', label.wh, 'Wh'), inp('run', 'Bench run', run.basis)],
          assumptions: [`Label energy: ${label.basis}.`, 'A power bank delivers 80–90 % of its cell energy at 5 V (REFERENCES §5 [CP]).'],
          warnings:
            share < 0.8
              ? [`${num(share * 100)} % of the label reaches the output, below the 80 % a sound conversion gives [CP].`]
              : share > 1
                ? ['More energy delivered than the label holds: check the run.']
                : [],
          implausible: share > 1.05,
        }),
      );
    }
  }
}

export function chargeFigures(ctx: FigureContext, loads: LoadSet): void {
  const { pack } = ctx;
  const charger = [...loads.converters.values()].find((c) => c.c.role === 'charge' && c.c.chargeCurrentA !== undefined);
  if (!pack || !charger) return;
  const current = charger.c.chargeCurrentA as number;
  const est = chargeTimeEstimate({ capacityAh: pack.ratedAh, chargeCurrentA: current });
  const warnings: string[] = [];
  const table = pack.p.chemistry === 'other' ? undefined : CELL_VOLTAGES[pack.p.chemistry];
  const cellLimit = pack.p.cellMaxVolts ?? table?.chargeV ?? undefined;
  if (cellLimit !== undefined && cellLimit !== null && charger.c.vout > cellLimit * pack.p.series * 1.01) {
    warnings.push(`Charge converter output ${num(charger.c.vout)} V is above the ${num(cellLimit * pack.p.series)} V charge limit of the pack: check the charger.`);
  }
  const rate = cRate(current, pack.ratedAh);
  ctx.figures.push(
    figure({
      key: 'charge.timeHours',
      label: 'Charge time from empty (estimate)',
      value: est.totalHours,
      unit: 'h',
      family: 'charge.timeHours',
      inputs: [
        inp('ratedAh', 'Pack rated capacity', pack.ratedAh, 'Ah'),
        inp('chargeAmps', 'Charge current', current, 'A'),
        inp('ccHours', 'Constant-current phase', est.ccHours, 'h'),
        inp('cvHours', 'Constant-voltage taper', est.cvHours, 'h'),
      ],
      assumptions: ['Rough CC-CV estimate: constant current to 80 % of capacity [CP], then an exponential taper to C/20.', 'Charger and cell losses are ignored; a real charge takes longer.'],
      warnings,
    }),
    figure({
      key: 'charge.cRate',
      label: 'Charge rate',
      value: rate,
      unit: 'C',
      family: 'charge.cRate',
      inputs: [inp('chargeAmps', 'Charge current', current, 'A'), inp('ratedAh', 'Pack rated capacity', pack.ratedAh, 'Ah')],
      warnings: rate > 1 ? ["Charging above 1 C: most Li-ion cells are rated for 0.5–1 C charge; check the cell maker's limit [CP]."] : [],
    }),
  );
  if (isUsbVolts(charger.c.vin)) {
    const atNominal = usbChargeInput({ packVolts: pack.volts, chargeAmps: current, efficiency: charger.eta, busVolts: charger.c.vin });
    const atMax = cellLimit ? usbChargeInput({ packVolts: cellLimit * pack.p.series, chargeAmps: current, efficiency: charger.eta, busVolts: charger.c.vin }) : atNominal;
    const portWarnings: string[] = [];
    if (!atMax.port)
      portWarnings.push(`${num(atMax.amps)} A at the end of the constant-current phase is more than a 5 V port supplies (${USB_PORT_LEVELS.at(-1)!.amps} A at most without USB Power Delivery).`);
    else if (atMax.amps > USB_PORT_LEVELS[0]!.amps)
      portWarnings.push(`Above 500 mA: a plain USB 2.0 port cannot supply it; it needs a ${atMax.port.label}. On a weaker port the charger must limit its input or the port voltage sags.`);
    ctx.figures.push(
      figure({
        key: 'charge.inputCurrent',
        label: 'Current drawn from the USB port while charging',
        value: atNominal.amps,
        unit: 'A',
        family: 'charge.inputCurrent',
        inputs: [
          inp('packVolts', 'Pack nominal voltage', pack.volts, 'V'),
          inp('chargeAmps', 'Charge current', current, 'A'),
          inp('efficiency', 'Charger efficiency', charger.eta),
          inp('busVolts', 'Port voltage', charger.c.vin, 'V'),
          inp('inputWatts', 'Input power', atNominal.watts, 'W'),
          inp('peakAmps', 'At the end of constant current (cell at its charge voltage)', atMax.amps, 'A'),
          inp('port', 'Smallest port that covers it', atMax.port?.label ?? 'none without USB Power Delivery'),
        ],
        assumptions: [
          ...(charger.note ? [charger.note] : []),
          'Average over the constant-current phase at the pack nominal voltage; the draw rises to the peak figure as the cells reach their charge voltage.',
        ],
        warnings: portWarnings,
      }),
    );
  }
}

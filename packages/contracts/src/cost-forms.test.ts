import { describe, expect, it } from 'vitest';
import { costModelFormSchema, manualRatesFormSchema, readVolume, setPartPriceBody, type CostModelFormValues } from './cost';

const form = (over: Partial<CostModelFormValues> = {}): CostModelFormValues => ({
  currency: 'usd',
  volumes: '1k, 10k; 100k',
  attritionByCategory: { passive: '2', ic: '' },
  defaultAttrition: '1',
  smtCostPerPlacement: '0,012',
  thtCostPerJoint: '0.03',
  thtJointsPerPart: '2',
  manualOperations: [{ label: 'Spot-weld cell tabs', minutes: '0.5' }],
  labourRatePerHour: '6',
  testMinutes: '1',
  packagingCost: '0.2',
  firstPassYield: '97.5',
  overheadFraction: '10',
  freightFraction: '3',
  insuranceFraction: '0.5',
  insuranceBasis: 'cif',
  dutyFraction: '0',
  retailMarginFraction: '40',
  platformMarginFraction: '15',
  confidenceBand: { high: '5', medium: '15', low: '30' },
  ...over,
});
const fields = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) => Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('the cost-model form', () => {
  it('reads percentages as shares, volumes with k/M, a decimal comma; a blank category uses the default', () => {
    const m = costModelFormSchema.parse(form());
    expect(m.currency).toBe('USD');
    expect(m.volumes).toEqual([1000, 10000, 100000]);
    expect(m.attritionByCategory).toEqual({ passive: 0.02 });
    expect(m.smtCostPerPlacement).toBe(0.012);
    expect(m.firstPassYield).toBe(0.975);
    expect(m.confidenceBand).toEqual({ high: 0.05, medium: 0.15, low: 0.3 });
    expect(readVolume('1.1k')).toBe(1100);
    expect(readVolume('2M')).toBe(2_000_000);
    expect(readVolume('lots')).toBeNaN();
  });

  it('names each field the model refuses under the form’s own name', () => {
    const r = costModelFormSchema.safeParse(form({ smtCostPerPlacement: '', volumes: '10k, 1k' }));
    expect(fields(r)).toEqual({ smtCostPerPlacement: 'Cost per placement must be a number', 'volumes.1': 'List volumes from small to large, each once' });
    const p = costModelFormSchema.safeParse(form({ overheadFraction: '120', confidenceBand: { high: 'x', medium: '1', low: '2' } }));
    expect(fields(p)).toEqual({ overheadFraction: 'At most 100 %', 'confidenceBand.high': 'Enter the band as a percentage such as "20 %"' });
  });
});

describe('the manual rates form', () => {
  it('becomes the rates by code, rows without a code left out, and names a rate by its code', () => {
    const ok = manualRatesFormSchema.parse({
      base: 'eur',
      date: '2026-11-27',
      source: 'By hand',
      rows: [
        { code: 'usd', rate: '1,08' },
        { code: ' ', rate: '' },
      ],
    });
    expect(ok).toMatchObject({ base: 'EUR', rates: { USD: 1.08 } });
    const bad = manualRatesFormSchema.safeParse({ base: 'EUR', date: '2026-02-30', source: 'By hand', rows: [{ code: 'GBP', rate: '' }] });
    expect(fields(bad)).toEqual({ date: 'Not a calendar date', 'rates.GBP': 'A rate must be a number' });
  });
});

describe('the price editor', () => {
  it('sends the breaks as typed; the server reads the amounts', () => {
    const body = setPartPriceBody.parse({ currency: 'usd', source: 'quote', confidence: 'high', priceDate: '2026-11-27', note: '', breaks: [{ minQty: '5k', unitPrice: '$0.12' }] });
    expect(body).toEqual({ currency: 'USD', source: 'quote', confidence: 'high', priceDate: '2026-11-27', note: undefined, breaks: [{ minQty: '5k', unitPrice: '$0.12' }] });
    expect(fields(setPartPriceBody.safeParse({ currency: 'US', source: 'quote', confidence: 'high', breaks: [] }))).toEqual({
      currency: 'Use a three-letter ISO 4217 code such as USD',
      breaks: 'Give at least one price break',
    });
  });
});

import { describe, expect, it } from 'vitest';
import { coverageText, metricHeader, metricText, rateCurrencies, scoreText, shortHeader } from './display';

describe('lineup display', () => {
  it('shows a missing value as a dash, never as zero', () => {
    expect(metricText(null, { format: 'quantity', unit: 'Wh' })).toBe('—');
    expect(metricText(undefined, { format: 'money', unit: 'USD' })).toBe('—');
    expect(metricText(0, { format: 'count', unit: 'findings' })).toBe('0');
    expect(scoreText(null)).toBe('—');
  });

  it('shows each kind of metric with its unit', () => {
    expect(metricText(9.99, { format: 'quantity', unit: 'Wh' })).toBe('9.99 Wh');
    expect(metricText(217.1739, { format: 'quantity', unit: 'Wh/kg' })).toBe('217 Wh/kg');
    expect(metricText(0.50251, { format: 'percent', unit: '%' })).toBe('50.3 %');
    expect(metricText(23.0918, { format: 'money', unit: 'EUR' })).toBe('€23.09');
    expect(metricHeader({ label: 'Pack energy', unit: 'Wh', format: 'quantity' })).toBe('Pack energy, Wh');
    expect(shortHeader({ short: 'Critical', unit: 'findings', format: 'count' })).toBe('Critical');
  });

  it('says how much of the weight a score rests on, only when it is not all of it', () => {
    expect(coverageText({ known: 1, weighted: 8, weightShare: 1 / 13 })).toBe('on 1 of 8 weighted metrics (8 % of the weight)');
    expect(coverageText({ known: 3, weighted: 3, weightShare: 1 })).toBeNull();
  });

  it('lists the currencies a rate table converts', () => {
    expect(rateCurrencies({ base: 'EUR', rates: { USD: 1.08, GBP: 0.85 } })).toEqual(['EUR', 'USD', 'GBP']);
    expect(rateCurrencies(null)).toEqual([]);
  });
});

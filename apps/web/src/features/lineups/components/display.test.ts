import { describe, expect, it } from 'vitest';
import { coverageText, lackedMetricsText, metricHeader, metricText, modeChoiceText, rateCurrencies, rowMode, rowModeText, sameModeChoice, scoreText, shortHeader } from './display';

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

  it('names the mode rule by its contract label, and a mode by name with the name asked for', () => {
    expect(modeChoiceText({ rule: 'highest' })).toBe('Most power at the main load (e.g. highest heat)');
    expect(modeChoiceText({ rule: 'power-bank' })).toBe('Power-bank output');
    expect(modeChoiceText({ rule: 'named', name: 'High' })).toBe('A mode by name: “High”');
    expect(sameModeChoice({ rule: 'named', name: 'High ' }, { rule: 'named', name: 'High' })).toBe(true);
    expect(sameModeChoice({ rule: 'named', name: 'Low' }, { rule: 'named', name: 'High' })).toBe(false);
    expect(sameModeChoice({ rule: 'highest', name: 'ignored' }, { rule: 'highest' })).toBe(true);
    expect(sameModeChoice({ rule: 'lowest' }, { rule: 'highest' })).toBe(false);
  });

  it('says where a row’s runtime comes from: the chosen mode, no modes recorded, or why there is none', () => {
    const teardown = { id: 1, date: '2026-10-12', unitLabel: null, status: 'published' as const };
    const chosen = { mode: { id: 2, name: 'High', reason: 'the most power at the main load' }, teardown, metrics: { runtimeH: 1.1 }, missing: {} };
    expect(rowMode(chosen)).toEqual({ kind: 'mode', name: 'High', reason: 'the most power at the main load' });
    expect(rowModeText(chosen)).toBe('High — the most power at the main load');
    const noModes = { mode: null, teardown, metrics: { runtimeH: 2.2 }, missing: {} };
    expect(rowMode(noModes).kind).toBe('no-modes');
    expect(rowModeText(noModes)).toMatch(/^No modes recorded/);
    const noFit = { mode: null, teardown, metrics: { runtimeH: null }, missing: { runtimeH: 'No recorded mode fits "Power-bank output".' } };
    expect(rowModeText(noFit)).toBe('— (No recorded mode fits "Power-bank output".)');
    expect(rowMode({ mode: null, teardown: null, metrics: {}, missing: {} })).toEqual({ kind: 'missing', reason: 'No teardown yet.' });
  });

  it('lists the weighted metrics a row lacks by their labels', () => {
    const metrics = [
      { key: 'runtimeH' as const, label: 'Runtime' },
      { key: 'shouldCost' as const, label: 'Should-cost' },
    ];
    expect(lackedMetricsText({ incompleteMetrics: ['runtimeH', 'shouldCost'] }, metrics)).toBe('Runtime, Should-cost');
    expect(lackedMetricsText({ incompleteMetrics: [] }, metrics)).toBeNull();
  });
});

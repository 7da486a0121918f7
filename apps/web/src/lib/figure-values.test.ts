import { describe, expect, it } from 'vitest';
import { figureInputValue } from './figure-values';

// The inputs beside a figure read as the forms and the report show the same values: grams below
// 1 kg, cm² below 0.1 m² (1 kg = 1000 g, 1 m² = 10⁴ cm² by definition [S: SI Brochure]; [C]).
describe('figureInputValue', () => {
  it.each<[number, string, string]>([
    [0.046, 'kg', '46.0 g'],
    [1.2, 'kg', '1.20 kg'],
    [0.0027, 'm²', '27.0 cm²'],
    [2.7, 'Ah', '2.70 Ah'],
    [0.35, 'A', '350 mA'],
  ])('%d %s → %s', (value, unit, text) => {
    expect(figureInputValue({ key: 'x', label: 'x', value, unit })).toBe(text);
  });

  it('keeps words, flags and plain numbers', () => {
    expect(figureInputValue({ key: 'x', label: 'x', value: true })).toBe('yes');
    expect(figureInputValue({ key: 'x', label: 'x', value: null })).toBe('—');
    expect(figureInputValue({ key: 'x', label: 'x', value: 2 })).toBe('2');
  });
});

import { describe, expect, it } from 'vitest';
import { formatMoney, formatPercent, formatQuantity, formatStored, sameQuantityText, sig } from './format';

describe('sig (three significant figures by default, LOOK.md)', () => {
  it('rounds to significant figures', () => {
    expect(sig(4.440833)).toBe('4.44');
    expect(sig(8.881667)).toBe('8.88');
    expect(sig(0.0012345)).toBe('0.00123');
    expect(sig(12345)).toBe('12,300');
    expect(sig(0)).toBe('0');
    expect(sig(9.996)).toBe('10.0');
  });
});

describe('formatQuantity (SI prefixes)', () => {
  it('chooses the prefix', () => {
    expect(formatQuantity(2.7, 'Ah')).toBe('2.70 Ah');
    expect(formatQuantity(0.35, 'A')).toBe('350 mA');
    expect(formatQuantity(4700, 'Ω')).toBe('4.70 kΩ');
    expect(formatQuantity(35e-6, 'm')).toBe('35.0 µm');
    expect(formatQuantity(1e-7, 'F')).toBe('100 nF');
    expect(formatQuantity(41.5, '°C')).toBe('41.5 °C');
  });
  it('shows missing values as a dash, never as zero', () => {
    expect(formatQuantity(null, 'W')).toBe('—');
    expect(formatQuantity(Number.NaN, 'W')).toBe('—');
  });
});

describe('formatMoney and formatPercent', () => {
  it('formats', () => {
    expect(formatMoney(12.5, 'USD')).toBe('US$12.50');
    expect(formatMoney(0.0123, 'EUR')).toBe('€0.0123');
    expect(formatPercent(0.8567)).toBe('85.7 %');
    expect(formatPercent(null)).toBe('—');
  });
});

describe('formatStored (stored SI values as people read them)', () => {
  it('shows grams and cm² for small masses and areas', () => {
    expect(formatStored(0.046, 'kg')).toBe('46.0 g');
    expect(formatStored(0.0027, 'm²')).toBe('27.0 cm²');
    expect(formatStored(2.7, 'Ah')).toBe('2.70 Ah');
    expect(formatStored(0.6, '')).toBe('0.600');
    expect(formatStored(null, 'V')).toBe('—');
  });
});

describe('sameQuantityText', () => {
  it('ignores spaces, case and trailing zeros, not the unit or the prefix', () => {
    expect(sameQuantityText('3.02 Ω', '3.020Ω')).toBe(true);
    expect(sameQuantityText('3.7 V', '3.70 V')).toBe(true);
    expect(sameQuantityText('10 kΩ', '10.0 kΩ')).toBe(true);
    expect(sameQuantityText('2700 mAh', '2.70 Ah')).toBe(false);
    expect(sameQuantityText('100 V', '1 V')).toBe(false);
  });
});

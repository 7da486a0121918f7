import { describe, it, expect } from 'vitest';
import { resistanceAtTemperature } from './temperature';

describe('resistance at temperature (REFERENCES §12 [S: CRC α copper 0.00393 /K])', () => {
  it('3.00 Ω copper at 60 °C is 3.4716 Ω; at 3.65 V 4.4408 W falls to 3.8376 W (−13.6 %) [C]', () => {
    const r = resistanceAtTemperature({ ohmsAt20: 3, alphaPerK: 0.00393, temperatureC: 60 });
    expect(r).toBeCloseTo(3.4716, 9);
    expect(3.65 ** 2 / r).toBeCloseTo(3.8376, 4);
    expect(1 - 3 / r).toBeCloseTo(0.1358, 3);
  });
  it('refuses a temperature where the linear model gives no resistance', () => {
    expect(() => resistanceAtTemperature({ ohmsAt20: 3, alphaPerK: 0.00393, temperatureC: -300 })).toThrow(/linear coefficient/);
  });
});

import { requireFinite, requirePositive } from '../shared/validate';

/** Resistance at a temperature from its 20 °C value: R(T) = R₂₀ · (1 + α · (T − 20 °C)) (REFERENCES §12 [S]). */
export function resistanceAtTemperature(p: { ohmsAt20: number; alphaPerK: number; temperatureC: number }): number {
  const r20 = requirePositive(p.ohmsAt20, 'Resistance at 20 °C (Ω)');
  const alpha = requireFinite(p.alphaPerK, 'Temperature coefficient (/K)');
  const t = requireFinite(p.temperatureC, 'Temperature (°C)');
  const r = r20 * (1 + alpha * (t - 20));
  if (!(r > 0)) throw new RangeError('The temperature is outside the range where the linear coefficient holds.');
  return r;
}

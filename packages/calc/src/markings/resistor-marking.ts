import { preferredValues } from './e-series';

/** EIA-96 multiplier letters as powers of ten [S: several decoders agree]. */
export const EIA96_MULTIPLIER_EXPONENT: Record<string, number> = {
  Z: -3, Y: -2, R: -2, X: -1, S: -1, A: 0, B: 1, H: 1, C: 2, D: 3, E: 4, F: 5,
};

const scaled = (n: number, p: number) => (p >= 0 ? n * 10 ** p : n / 10 ** -p);

/** The three-digit E96 significand (100 … 976) that an EIA-96 index 1 … 96 stands for. */
export function eia96Significand(index: number): number {
  if (!Number.isInteger(index) || index < 1 || index > 96) {
    throw new RangeError(`EIA-96 index must be a whole number from 01 to 96 (got ${index}).`);
  }
  return Math.round((preferredValues('E96')[index - 1] as number) * 100);
}

/**
 * Resistance of an SMD resistor marking (Ω): 3-digit ("472" = 4.7 kΩ, "100" = 10 Ω), 4-digit ("4991" = 4.99 kΩ),
 * R as the decimal point ("4R7", "R010", "12R0"), EIA-96 ("68X" = 49.9 Ω) and "0"/"000" jumpers (0 Ω).
 * Two digits followed by R are read as EIA-96 ("12R" = 1.30 Ω), as the code tables do.
 */
export function decodeResistorMarking(code: string): number {
  if (typeof code !== 'string' || code.trim() === '') throw new RangeError('Resistor marking is empty.');
  const s = code.trim().toUpperCase();
  if (/^0{1,4}$/.test(s)) return 0;
  const eia = /^(\d{2})([ZYRXSABHCDEF])$/.exec(s);
  if (eia) {
    const index = Number(eia[1]);
    if (index < 1 || index > 96) {
      throw new RangeError(`Resistor marking "${code}": an EIA-96 code needs an index from 01 to 96 (got ${eia[1]}).`);
    }
    return scaled(eia96Significand(index), EIA96_MULTIPLIER_EXPONENT[eia[2] as string] as number);
  }
  if (/^\d{3,4}$/.test(s)) {
    const significand = Number(s.slice(0, -1));
    return scaled(significand, Number(s.slice(-1)));
  }
  if (/^\d*R\d*$/.test(s) && s.length >= 2 && s.length <= 5) {
    const [whole, fraction] = s.split('R') as [string, string];
    return Number(`${whole || '0'}.${fraction || '0'}`);
  }
  throw new RangeError(
    `Resistor marking "${code}" is not a 3- or 4-digit code (472, 4991), R notation (4R7, R010) or an EIA-96 code (68X).`,
  );
}

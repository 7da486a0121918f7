const PICO_PER: Record<string, number> = { p: 1, r: 1, n: 1e3, u: 1e6 };

/**
 * Capacitance of a capacitor marking (F): 3-digit pF code ("104" = 100 nF; last digit 8 = ×0.01, 9 = ×0.1 [M]),
 * optionally followed by a tolerance letter ("104K"); a letter as the decimal point ("4p7", "2n2", "4u7", "4R7" = 4.7 pF);
 * a value with a unit ("100n", "0.1u", "10uF"); or one or two digits, read as pF ("47").
 */
export function decodeCapacitorMarking(code: string): number {
  if (typeof code !== 'string' || code.trim() === '') throw new RangeError('Capacitor marking is empty.');
  const s = code.trim().replace(/[µμ]/g, 'u').toLowerCase();

  const three = /^(\d{2})(\d)[bcdfgjkmz]?$/.exec(s);
  if (three) {
    const significand = Number(three[1]);
    const last = Number(three[2]);
    if (last === 7) {
      throw new RangeError(`Capacitor marking "${code}": a last digit of 7 is not used in the 3-digit code.`);
    }
    if (last === 8) return significand / 1e14;
    if (last === 9) return significand / 1e13;
    return (significand * 10 ** last) / 1e12;
  }
  if (/^\d{1,2}$/.test(s)) return Number(s) / 1e12;

  const letter = /^(\d*)([pnur])(\d*)f?$/.exec(s);
  if (letter && (letter[1] !== '' || letter[3] !== '')) {
    const value = Number(`${letter[1] || '0'}.${letter[3] || '0'}`);
    return (value * (PICO_PER[letter[2] as string] as number)) / 1e12;
  }
  const decimal = /^(\d+\.\d+)([pnu])f?$/.exec(s);
  if (decimal) return (Number(decimal[1]) * (PICO_PER[decimal[2] as string] as number)) / 1e12;

  throw new RangeError(
    `Capacitor marking "${code}" is not a 3-digit pF code (104) or a value with p, n, u or R as the decimal point (4p7, 2n2, 4R7).`,
  );
}

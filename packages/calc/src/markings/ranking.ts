/**
 * Ranking the readings of a marking that reads more than one way (most likely first).
 *
 * The rule (this decoder's own, common practice [CP]; DEVELOPERS.md "Marking decoder" says the same):
 * 1. When one reading takes the last letter as part of the value (the decimal point and multiplier of
 *    the IEC 60062 letter-and-digit code, "102K" = 102 kΩ; the unit of a capacitor value, "104n" =
 *    104 nF) and another takes it as a tolerance letter ("102" ±10 %, "104" ±30 %), the reading whose
 *    value is in the coarser IEC 60063 series goes first (E6 before E12 … E192 before no series):
 *    "102K" is 1 kΩ ±10 % (E6) before 102 kΩ (E96 only). On a tie the letter is read as part of the
 *    value first: "100K" is 100 kΩ before 10 Ω ±10 %, "100n" is 100 nF before 10 pF ±30 %.
 * 2. Otherwise by the code form: a 0 Ω jumper; the letter-and-digit code, plain digit codes and the
 *    capacitor forms; a digit code with a tolerance letter; EIA-96 last. So two digits and R are
 *    R-notation first ("10R" = 10 Ω), and the EIA-96 reading (1.24 Ω) second.
 * 3. A later reading with the same value and tolerance as an earlier one is not listed again
 *    ("01R" is 1 Ω both as R-notation and as EIA-96); the first says so in its meaning.
 */
import { withPrefix } from '../shared/text';
import { E_SERIES, isPreferredValue, type ESeries } from './e-series';

/** What the last letter of the code is in a reading. */
export type LetterUse = 'value' | 'tolerance' | 'none';

/** A reading before ranking: its value, what it makes of the code, and how to name it in the ranking note. */
export interface Candidate {
  /** SI value (Ω or F). */
  value: number;
  unit: string;
  /** Position by code form (rule 2): lower goes first. */
  order: number;
  letter: LetterUse;
  toleranceLetter: string | null;
  /** How the reading takes the code, in words ("R-notation, IEC 60062", "\"102\" with tolerance letter K"). */
  what: string;
  /** The code form in a few words, for the ranking note ("R-notation", "EIA-96"). */
  form: string;
  meaning: string[];
}

export interface Ranked<T extends Candidate> {
  readings: T[];
  /** The rule that put the first two readings in their order; null with one reading. */
  reason: string | null;
}

/** The coarsest IEC 60063 series a value belongs to, or null (0 Ω and odd values). */
export function coarsestSeries(value: number): ESeries | null {
  if (!(value > 0) || !Number.isFinite(value)) return null;
  return E_SERIES.find((s) => isPreferredValue(value, s)) ?? null;
}

const seriesIndex = (value: number) => {
  const s = coarsestSeries(value);
  return s === null ? E_SERIES.length : E_SERIES.indexOf(s);
};

/** Rule 1 applies between a reading that uses the letter in the value and one that reads it as a tolerance. */
const letterPair = (a: Candidate, b: Candidate) => (a.letter === 'tolerance' && b.letter === 'value') || (a.letter === 'value' && b.letter === 'tolerance');

function compare(a: Candidate, b: Candidate): number {
  if (letterPair(a, b)) {
    const tol = a.letter === 'tolerance' ? a : b;
    const val = tol === a ? b : a;
    const tolFirst = seriesIndex(tol.value) < seriesIndex(val.value);
    return (tolFirst ? tol === a : val === a) ? -1 : 1;
  }
  return a.order - b.order;
}

const sameReading = (a: Candidate, b: Candidate) => a.toleranceLetter === b.toleranceLetter && Math.abs(a.value - b.value) <= 1e-12 * Math.max(Math.abs(a.value), Math.abs(b.value));

const seriesText = (value: number) => {
  const s = coarsestSeries(value);
  return s === null ? 'in no IEC 60063 series' : `in ${s}`;
};

function reasonFor(first: Candidate, second: Candidate): string {
  const a = `${withPrefix(first.value, first.unit)} (${first.what})`;
  const b = `${withPrefix(second.value, second.unit)} (${second.what})`;
  if (letterPair(first, second)) {
    const tol = first.letter === 'tolerance' ? first : second;
    const val = tol === first ? second : first;
    const why =
      seriesIndex(tol.value) === seriesIndex(val.value)
        ? `both values are ${seriesText(val.value)}, so the letter is read as part of the value first`
        : `${withPrefix(first.value, first.unit)} is ${seriesText(first.value)} and ${withPrefix(second.value, second.unit)} ${seriesText(second.value)}, so the value in the coarser series goes first`;
    return `Read first as ${a}, then as ${b}: ${why}.`;
  }
  return `Read first as ${a}, then as ${b}: ${first.form} goes before ${second.form}.`;
}

/** Orders the readings of one code on one kind of part by the rule above and drops repeated values. */
export function rankCandidates<T extends Candidate>(candidates: T[]): Ranked<T> {
  const sorted = [...candidates].sort(compare);
  const readings: T[] = [];
  for (const c of sorted) {
    const same = readings.find((r) => sameReading(r, c));
    if (same) same.meaning = [...same.meaning, `Read as ${c.what} it gives the same value.`];
    else readings.push(c);
  }
  const reason = readings.length > 1 ? reasonFor(readings[0] as T, readings[1] as T) : null;
  return { readings, reason };
}

/**
 * Which operating mode of a device a lineup compares: the one with the most (or least) power at its
 * main load, the one in which its USB output runs, or the one of a given name.
 */
export type ModeRule = 'highest' | 'lowest' | 'power-bank' | 'named';
export const MODE_RULES: readonly ModeRule[] = ['highest', 'lowest', 'power-bank', 'named'];

export interface ModeCandidate {
  id: string;
  name: string;
  /** Average power at the device's main load in the mode (W); 0 when the main load is off. */
  mainLoadWatts: number;
  /** A USB output load runs in the mode. */
  usbOutput: boolean;
}

export interface ModeChoice {
  id: string;
  name: string;
  /** Why this mode, in words. */
  reason: string;
}

/** The mode a lineup compares for one device under a rule; null with no mode that fits. Ties: the first recorded. */
export function chooseMode(modes: ModeCandidate[], rule: { rule: ModeRule; name?: string }): ModeChoice | null {
  if (!Array.isArray(modes)) throw new RangeError('modes must be a list.');
  if (!MODE_RULES.includes(rule.rule)) throw new RangeError(`Mode rule must be one of ${MODE_RULES.join(', ')} (got "${String(rule.rule)}").`);
  const pick = (m: ModeCandidate | undefined, reason: string) => (m ? { id: m.id, name: m.name, reason } : null);
  if (rule.rule === 'named') {
    const wanted = (rule.name ?? '').trim().toLowerCase();
    if (!wanted) throw new RangeError('Give the mode name to compare.');
    return pick(
      modes.find((m) => m.name.trim().toLowerCase() === wanted),
      `the mode named "${rule.name!.trim()}"`,
    );
  }
  if (rule.rule === 'power-bank')
    return pick(
      modes.find((m) => m.usbOutput),
      'the mode in which the USB output runs',
    );
  const on = modes.filter((m) => m.mainLoadWatts > 0);
  if (on.length === 0) return null;
  const best = on.reduce((a, b) => ((rule.rule === 'highest' ? b.mainLoadWatts > a.mainLoadWatts : b.mainLoadWatts < a.mainLoadWatts) ? b : a));
  return pick(best, rule.rule === 'highest' ? 'the most power at the main load' : 'the least power at the main load (still on)');
}

// Safety cautions, in one place: the overview, the power system and photo steps, and the figures
// panel all show these same words. Calm and specific; they defer to the lab's rules and local codes.

/** Before opening a device with a lithium cell (or one that may have one). */
export const LITHIUM_CELL_CAUTION = {
  title: 'Lithium cell: before you open the case',
  /** The points in one line, for places where the full list is one click away. */
  summary: 'Discharge it first; no puncturing or bending pouch cells; insulated tools; a fire-safe surface; stop at any swelling.',
  points: [
    'Discharge the cell first (about 3.0 V per cell for Li-ion) and measure it before cutting or desoldering anything.',
    'Do not puncture, bend or crush pouch cells; lift them with plastic tools, never a blade or a screwdriver.',
    'Use insulated tools and tape over exposed tabs: a short across the terminals can start a fire.',
    'Work on a fire-safe surface with a lidded metal box or sand within reach.',
    'A swollen, hot, hissing or smelling cell: stop, move it into the fire-safe box away from people, and do not charge it again.',
  ],
  defer: "These notes do not replace your lab's safety rules, local codes or licensed practice.",
} as const;

/** When the cells are not recorded yet: most devices in this workspace run on lithium cells. */
export const UNKNOWN_CELL_NOTE = 'Treat the cell as lithium until you have read its marking.';

/** Next to touch-temperature and surface-temperature figures. */
export const HOT_SURFACE_CAUTION =
  'Hot surface: measure the real surface temperature with a thermocouple before anyone holds the device, keep skin contact short, ' + "and follow the lab's safety rules.";

/** Mains chargers and adapters. */
export const MAINS_CAUTION = 'Mains charger: unplug it and let the capacitors discharge before opening; work on mains only under licensed practice.';

/** Shown with every set of derived figures. */
export const ESTIMATES_NOTE = "Engineering estimates, not certification results. Follow your lab's safety rules, local codes and licensed practice.";

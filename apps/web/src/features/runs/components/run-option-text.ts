// Words shared by the upload form and the run settings form.

/** What the charge termination field means. */
export const TERMINATION_HINT = "C of the pack's rated capacity: 0.05 C is C/20 (blank), 0.1 C is C/10. Without a pack record, the share of the constant current.";

/** The workspace debounce as a field shows it ("5 s"), while the setting loads a plain word. */
export const debounceDefaultText = (seconds: number | undefined) => (seconds === undefined ? 'setting' : `setting (${seconds} s)`);

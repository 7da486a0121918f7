import { Caution } from '@/components/caution';

/**
 * Cautions for working on lithium cells, shown in the power-system section of a lithium pack.
 * Kept here until the shared caution texts (packages/contracts cautions) land; then this list moves there.
 */
export const POWER_SECTION_LITHIUM_CAUTION = {
  title: 'Lithium cells: before and while you open the pack',
  items: [
    'Discharge the cells before opening the pack (many labs go to about 3.0 V per Li-ion cell) and measure the voltage first.',
    'Never puncture, bend, crush or cut a pouch cell. Lift it with plastic tools, never a blade or a screwdriver.',
    'Use insulated tools; cut one tab or lead at a time and tape each bare terminal so nothing can short it.',
    'Work on a fire-safe surface, away from anything that burns, with sand or a lithium-rated extinguisher at hand.',
    'A swollen, hot, hissing or sweet-smelling cell: stop, do not open it, move it into a fire-safe container and follow your lab’s procedure for damaged cells.',
  ],
  footer: 'These notes do not replace your lab’s safety rules, local codes or licensed practice.',
} as const;

export const POWER_SECTION_HEATER_CAUTION = {
  title: 'Hot surfaces',
  text: 'Heater plates can pass the burn threshold within minutes. Let them cool before handling, and measure surface temperature with a thermocouple, not by touch.',
} as const;

export function LithiumCaution() {
  const c = POWER_SECTION_LITHIUM_CAUTION;
  return (
    <Caution title={c.title}>
      <ul className="mt-1 list-disc space-y-0.5 pl-4 text-[13px] leading-snug">
        {c.items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
      <p className="mt-1.5 text-xs">{c.footer}</p>
    </Caution>
  );
}

export function HeaterCaution() {
  return <Caution title={POWER_SECTION_HEATER_CAUTION.title}>{POWER_SECTION_HEATER_CAUTION.text}</Caution>;
}

import { describe, it, expect } from 'vitest';
import { lithiumIonShipping } from './shipping';

describe('lithium-ion shipping by air (REFERENCES §12 [S: IATA DGR, Section II of PI 965–970; M for edition detail])', () => {
  it('alone: UN 3480, PI 965, Section II for a 9.99 Wh battery, at most 30 % charge [S]', () => {
    const s = lithiumIonShipping({ cellWh: 9.99, batteryWh: 9.99, arrangement: 'alone' });
    expect(s).toMatchObject({ unNumber: 'UN 3480', packingInstruction: 'PI 965', sectionII: true, stateOfChargeLimit: 0.3 });
  });
  it('packed with equipment: UN 3481, PI 966, the 30 % rule from 2026 [M]', () => {
    const s = lithiumIonShipping({ cellWh: 12, batteryWh: 48, arrangement: 'packed-with' });
    expect(s).toMatchObject({ unNumber: 'UN 3481', packingInstruction: 'PI 966', sectionII: true, stateOfChargeLimit: 0.3 });
    expect(s.rules.join(' ')).toMatch(/\[M\]/);
  });
  it('contained in equipment: UN 3481, PI 967, no charge limit; Section II ends above 20 Wh a cell or 100 Wh a battery ("not exceeding") [S]', () => {
    expect(lithiumIonShipping({ cellWh: 20, batteryWh: 100, arrangement: 'contained-in' })).toMatchObject({ packingInstruction: 'PI 967', sectionII: true, stateOfChargeLimit: null });
    expect(lithiumIonShipping({ cellWh: 20.1, batteryWh: 40, arrangement: 'contained-in' }).sectionII).toBe(false);
    expect(lithiumIonShipping({ cellWh: 10, batteryWh: 100.8, arrangement: 'contained-in' }).rules.join(' ')).toMatch(/battery is over 100 Wh/);
  });
  it('refuses bad inputs', () => {
    expect(() => lithiumIonShipping({ cellWh: -1, batteryWh: 1, arrangement: 'alone' })).toThrow(/Cell energy/);
    expect(() => lithiumIonShipping({ cellWh: 1, batteryWh: 1, arrangement: 'by-sea' as never })).toThrow(/arrangement/);
  });
});

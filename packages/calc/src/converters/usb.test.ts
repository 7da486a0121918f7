import { describe, it, expect } from 'vitest';
import { usbChargeInput } from './usb';

describe('USB charge input (REFERENCES §5, §12)', () => {
  it('1 A into 3.7 V at η 0.85 from 5 V: 4.353 W, 0.8706 A, a USB 3.x port covers it [C; S: USB 3.x 900 mA]', () => {
    const r = usbChargeInput({ packVolts: 3.7, chargeAmps: 1, efficiency: 0.85 });
    expect(r.watts).toBeCloseTo(4.352941, 6);
    expect(r.amps).toBeCloseTo(0.870588, 6);
    expect(r.port?.amps).toBe(0.9);
  });
  it('0.4 A fits a USB 2.0 port; 3.5 A fits none without Power Delivery [S]', () => {
    expect(usbChargeInput({ packVolts: 3.7, chargeAmps: 0.5, efficiency: 0.925 }).port?.amps).toBe(0.5);
    expect(usbChargeInput({ packVolts: 7.4, chargeAmps: 2, efficiency: 0.85 }).port).toBeNull();
    expect(() => usbChargeInput({ packVolts: 3.7, chargeAmps: 1, efficiency: 1.2 })).toThrow(/Charger efficiency/);
  });
});

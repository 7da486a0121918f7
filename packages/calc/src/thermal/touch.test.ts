import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { burnThresholdC, burnThresholdDetail, touchMarginC, SURFACE_MATERIALS, type SurfaceMaterial } from './touch';

const t = (material: SurfaceMaterial, contactSeconds: number) => burnThresholdC({ material, contactSeconds });

describe('burn thresholds (REFERENCES §6 and Decisions)', () => {
  it('1 min → 51 °C for metal; 10 min → 48 °C, 8 h → 43 °C for every material [M: ISO 13732-1]', () => {
    expect(t('metal', 60)).toBe(51);
    for (const m of SURFACE_MATERIALS) {
      expect(t(m, 600)).toBe(48);
      expect(t(m, 8 * 3600)).toBe(43);
    }
  });
  it('under 10 s: metal 55 °C, non-metal 65 °C; under 1 s: metal 65 °C, non-metal 85 °C [S: ECMA-287]', () => {
    expect(t('metal', 5)).toBe(55);
    expect(t('plastic', 5)).toBe(65);
    expect(t('metal', 0.5)).toBe(65);
    expect(t('plastic', 0.5)).toBe(85);
  });
  it('glass takes the non-metal value [M]', () => {
    expect(t('glass', 0.5)).toBe(85);
    expect(t('glass', 5)).toBe(65);
  });
  it('between listed durations the next longer listed duration applies (conservative) [Decisions]', () => {
    expect(t('metal', 1)).toBe(65);
    expect(t('metal', 1.5)).toBe(55);
    expect(t('metal', 10)).toBe(55);
    expect(t('plastic', 11)).toBe(60);
    expect(t('metal', 30)).toBe(51);
    expect(t('metal', 61)).toBe(48);
    expect(t('plastic', 300)).toBe(48);
    expect(t('metal', 601)).toBe(43);
    expect(t('glass', 3600)).toBe(43);
  });
  it('8 h or longer stays at 43 °C [S: ECMA-287 continuous hold]', () => {
    expect(t('plastic', 24 * 3600)).toBe(43);
    expect(burnThresholdDetail({ material: 'metal', contactSeconds: 1e7 }).listedSeconds).toBe(28800);
  });
  it('reports the listed duration and source used', () => {
    const d = burnThresholdDetail({ material: 'metal', contactSeconds: 45 });
    expect(d).toMatchObject({ thresholdC: 51, listedSeconds: 60 });
    expect(d.source).toMatch(/ISO 13732-1/);
  });
  it('the threshold never rises with longer contact, and metal is never above non-metal (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1e6, noNaN: true }), fc.double({ min: 0.01, max: 1e6, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        for (const m of SURFACE_MATERIALS) expect(t(m, hi)).toBeLessThanOrEqual(t(m, lo));
        expect(t('metal', a)).toBeLessThanOrEqual(t('plastic', a));
      }),
    );
  });
  it('rejects unknown materials and non-positive times', () => {
    expect(() => t('stone' as never, 60)).toThrow(/Surface material/);
    expect(() => t('metal', 0)).toThrow(/Contact time/);
    expect(() => t('metal', Number.NaN)).toThrow(RangeError);
  });
});

describe('touch margin', () => {
  it('a 55 °C surface held 1 min has a margin of −4 °C on metal and 5 °C on plastic [C; M: ISO 13732-1]', () => {
    expect(touchMarginC({ surfaceC: 55, material: 'metal', contactSeconds: 60 })).toBe(-4);
    expect(touchMarginC({ surfaceC: 55, material: 'plastic', contactSeconds: 60 })).toBe(5);
  });
  it('a 45 °C metal surface touched 5 s has 10 °C in hand [C]', () => {
    expect(touchMarginC({ surfaceC: 45, material: 'metal', contactSeconds: 5 })).toBe(10);
  });
  it('rejects a missing surface temperature', () => {
    expect(() => touchMarginC({ surfaceC: Number.NaN, material: 'metal', contactSeconds: 5 })).toThrow(/Surface temperature/);
  });
});

describe('burn thresholds at 1 min by material (issue 10 §2.4; REFERENCES §6 [M: ISO 13732-1])', () => {
  it('metal 51 °C, ceramics/glass 56 °C, plastics 60 °C, wood 60 °C', () => {
    expect(burnThresholdC({ material: 'metal', contactSeconds: 60 })).toBe(51);
    expect(burnThresholdC({ material: 'metal-coated', contactSeconds: 60 })).toBe(51);
    expect(burnThresholdC({ material: 'glass', contactSeconds: 60 })).toBe(56);
    expect(burnThresholdC({ material: 'plastic', contactSeconds: 60 })).toBe(60);
    expect(burnThresholdC({ material: 'wood', contactSeconds: 60 })).toBe(60);
  });
  it('10 min 48 °C and 8 h 43 °C for every material', () => {
    for (const material of ['metal', 'metal-coated', 'glass', 'plastic', 'wood'] as const) {
      expect(burnThresholdC({ material, contactSeconds: 600 })).toBe(48);
      expect(burnThresholdC({ material, contactSeconds: 8 * 3600 })).toBe(43);
    }
  });
});

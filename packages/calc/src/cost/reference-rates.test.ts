import { describe, expect, it } from 'vitest';
import { XMLParser } from 'fast-xml-parser';
// Invented demo rates in the published daily-file structure (labelled so in the file).
import demoXml from '../../../../tests/fixtures/eurofxref-demo.xml?raw';
import { convertCurrency, crossRate } from './currency';
import { referenceRatesFromTree } from './reference-rates';

// The parser settings the API uses: attributes as '@_name', every value kept as text.
const parse = (xml: string) => new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@_', parseAttributeValue: false, parseTagValue: false, processEntities: false }).parse(xml);

describe('referenceRatesFromTree — the fixture in the published daily-file structure [S: ECB rate page; published sample files]', () => {
  const table = referenceRatesFromTree(parse(demoXml));

  it('reads the base, the day and one rate per Cube currency/rate (units per 1 EUR; EUR not listed)', () => {
    expect(table).toEqual({
      base: 'EUR',
      date: '2026-11-27',
      days: 1,
      rates: { USD: 1.08, JPY: 162.5, GBP: 0.85, CHF: 0.95, CNY: 7.8, HKD: 8.4, KRW: 1500 },
    });
  });

  it('gives cross rates through the base: 1 A = (rate_B / rate_A) B, rounded only at the end [S: ECB convention; C]', () => {
    // USD → CNY: 7.80 / 1.08 = 7.222222…; 100 USD = 722.2222 CNY
    expect(crossRate(table, 'USD', 'CNY')).toBeCloseTo(7.2222222222, 9);
    expect(convertCurrency(100, 'USD', 'CNY', table)).toBeCloseTo(722.2222222, 6);
    // CNY → USD: 1.08 / 7.80 = 0.138461538
    expect(crossRate(table, 'CNY', 'USD')).toBeCloseTo(0.138461538, 9);
    // GBP → USD: 1.08 / 0.85 = 1.270588235
    expect(crossRate(table, 'GBP', 'USD')).toBeCloseTo(1.270588235, 9);
    // CNY → JPY: 162.50 / 7.80 = 20.833333
    expect(crossRate(table, 'CNY', 'JPY')).toBeCloseTo(20.8333333, 7);
    // 10 000 KRW → GBP: 10 000 / 1500 × 0.85 = 5.666667
    expect(convertCurrency(10_000, 'KRW', 'GBP', table)).toBeCloseTo(5.6666667, 7);
    // To the base: divide by the rate. 250 USD = 250 / 1.08 = 231.481481 EUR
    expect(convertCurrency(250, 'USD', 'EUR', table)).toBeCloseTo(231.481481, 6);
    expect(crossRate(table, 'EUR', 'JPY')).toBe(162.5);
    expect(crossRate(table, 'usd', 'USD')).toBe(1);
    // A cross rate and its reverse multiply to 1 [C].
    expect(crossRate(table, 'HKD', 'CHF') * crossRate(table, 'CHF', 'HKD')).toBeCloseTo(1, 12);
  });

  it('checks the §9 illustrative rates written in the same structure: USD → CNY 7.231024, GBP → USD 1.267188 [S: REFERENCES §9; C]', () => {
    const xml = `<?xml version="1.0" encoding="UTF-8"?>
<gesmes:Envelope xmlns:gesmes="http://www.gesmes.org/xml/2002-08-01" xmlns="http://www.ecb.int/vocabulary/2002-08-01/eurofxref">
  <gesmes:subject>Reference rates</gesmes:subject>
  <Cube><Cube time='2026-01-05'><Cube currency='USD' rate='1.0856'/><Cube currency='CNY' rate='7.85'/><Cube currency='GBP' rate='0.8567'/></Cube></Cube>
</gesmes:Envelope>`;
    const t = referenceRatesFromTree(parse(xml));
    expect(crossRate(t, 'USD', 'CNY')).toBeCloseTo(7.231024, 6);
    expect(crossRate(t, 'CNY', 'USD')).toBeCloseTo(0.138293, 6);
    expect(crossRate(t, 'GBP', 'USD')).toBeCloseTo(1.267188, 6);
    expect(convertCurrency(250, 'USD', 'EUR', t)).toBeCloseTo(230.2874, 4);
  });

  it('reads the latest day of a history file with several Cube time elements [M: history-file layout]', () => {
    const xml = `<gesmes:Envelope xmlns:gesmes="http://www.gesmes.org/xml/2002-08-01" xmlns="http://www.ecb.int/vocabulary/2002-08-01/eurofxref">
  <Cube>
    <Cube time="2026-11-25"><Cube currency="USD" rate="1.07"/></Cube>
    <Cube time="2026-11-27"><Cube currency="USD" rate="1.09"/><Cube currency="GBP" rate="0.86"/></Cube>
    <Cube time="2026-11-26"><Cube currency="USD" rate="1.08"/></Cube>
  </Cube>
</gesmes:Envelope>`;
    expect(referenceRatesFromTree(parse(xml))).toEqual({ base: 'EUR', date: '2026-11-27', days: 3, rates: { USD: 1.09, GBP: 0.86 } });
  });
});

describe('referenceRatesFromTree — anything else is refused, naming the element or attribute', () => {
  const envelope = (inner: string) => `<gesmes:Envelope xmlns:gesmes="http://www.gesmes.org/xml/2002-08-01" xmlns="http://www.ecb.int/vocabulary/2002-08-01/eurofxref">${inner}</gesmes:Envelope>`;
  const read = (xml: string) => () => referenceRatesFromTree(parse(xml));

  it('refuses other XML documents', () => {
    expect(read('<?xml version="1.0"?><rates><rate currency="USD" value="1.08"/></rates>')).toThrow(
      /^file: this is not the euro reference-rate XML format: the root element must be gesmes:Envelope \(found <rates>\)/,
    );
    expect(read('')).toThrow(/root element must be gesmes:Envelope \(found none\)/);
    expect(() => referenceRatesFromTree(null)).toThrow(/the document is empty/);
    expect(() => referenceRatesFromTree('text' as never, 'upload')).toThrow(/^upload: /);
  });

  it('names the missing or wrong part', () => {
    expect(read(envelope('<gesmes:subject>Reference rates</gesmes:subject>'))).toThrow(/gesmes:Envelope has no Cube element/);
    expect(read(envelope('<Cube></Cube>'))).toThrow(/the Cube element has no Cube time="YYYY-MM-DD" children/);
    expect(read(envelope('<Cube><Cube time="27/11/2026"><Cube currency="USD" rate="1.08"/></Cube></Cube>'))).toThrow(/Cube\[1\]@time must be a date YYYY-MM-DD \(got "27\/11\/2026"\)/);
    expect(read(envelope('<Cube><Cube time="2026-02-30"><Cube currency="USD" rate="1.08"/></Cube></Cube>'))).toThrow(/Cube\[1\]@time must be a date/);
    expect(read(envelope('<Cube><Cube><Cube currency="USD" rate="1.08"/></Cube></Cube>'))).toThrow(/Cube\[1\]@time must be a date YYYY-MM-DD \(got null\)/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"></Cube></Cube>'))).toThrow(/Cube time="2026-11-27" has no Cube currency\/rate entries/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"><Cube currency="US Dollar" rate="1.08"/></Cube></Cube>'))).toThrow(/Cube time="2026-11-27" › Cube\[1\]@currency must be a three-letter code/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"><Cube currency="USD" rate="1,08"/></Cube></Cube>'))).toThrow(/Cube\[1\]@rate for USD must be a decimal number \(got "1,08"\)/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"><Cube currency="USD"/></Cube></Cube>'))).toThrow(/@rate for USD must be a decimal number \(got null\)/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"><Cube currency="USD" rate="0.000"/></Cube></Cube>'))).toThrow(/@rate for USD must be greater than zero/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"><Cube currency="USD" rate="1.08"/><Cube currency="USD" rate="1.09"/></Cube></Cube>'))).toThrow(/Cube\[2\]: USD is listed twice for 2026-11-27/);
    expect(read(envelope('<Cube><Cube time="2026-11-27"><Cube currency="EUR" rate="1.2"/></Cube></Cube>'))).toThrow(/EUR is the base/);
    // EUR listed at 1 is harmless and left out.
    expect(referenceRatesFromTree(parse(envelope('<Cube><Cube time="2026-11-27"><Cube currency="EUR" rate="1"/><Cube currency="USD" rate="1.08"/></Cube></Cube>'))).rates).toEqual({
      USD: 1.08,
    });
  });
});

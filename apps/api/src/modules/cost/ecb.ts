// The euro reference-rate XML file (REFERENCES §9): parse the upload and read it with calc.
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { referenceRatesFromTree, type ReferenceRates } from '@splitcase/calc';
import { validationError } from '../../http/errors';

// Attributes as '@_name', every value kept as text, no entity expansion (nothing to expand in
// the published file, and expansion is how hostile XML grows).
const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  parseAttributeValue: false,
  parseTagValue: false,
  processEntities: false,
});

/** Rates of the latest day in the file; a 400 naming `file` when it is not well-formed XML or not that format. */
export function parseReferenceRateXml(buffer: Buffer): ReferenceRates {
  const text = buffer.toString('utf8').replace(/^\uFEFF/, '');
  if (text.trim() === '') throw validationError({ file: 'The file is empty. Upload the euro reference-rate XML file.' });
  const valid = XMLValidator.validate(text);
  if (valid !== true) {
    throw validationError({ file: `The file is not well-formed XML (line ${valid.err.line}: ${valid.err.msg}). Upload the euro reference-rate XML file.` });
  }
  try {
    return referenceRatesFromTree(parser.parse(text), 'file');
  } catch (err) {
    if (err instanceof RangeError) throw validationError({ file: err.message.replace(/^file: /, '').replace(/^./, (c) => c.toUpperCase()) });
    throw err;
  }
}

// The euro reference-rate XML file (REFERENCES §9): parse the upload and read it with calc.
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { referenceRatesFromTree, type ReferenceRates } from '@splitcase/calc';
import { validationError } from '../../http/errors';

/** The published file nests four deep (Envelope › Cube › Cube › Cube); anything far deeper is refused. */
export const MAX_XML_DEPTH = 32;

// Attributes as '@_name', every value kept as text, no entity expansion (nothing to expand in
// the published file, and expansion is how hostile XML grows).
const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  parseAttributeValue: false,
  parseTagValue: false,
  processEntities: false,
  maxNestedTags: MAX_XML_DEPTH,
});

/**
 * The published file has no document type. A DOCTYPE (and with it any entity declaration) is how
 * hostile XML reads local files (external entities), calls out (parameter entities) or grows to
 * gigabytes (billion laughs): it is refused before the file is parsed, however harmless it looks.
 */
const DOCTYPE = /<!\s*(DOCTYPE|ENTITY)/i;

/** Rates of the latest day in the file; a 400 naming `file` when it is not well-formed XML or not that format. */
export function parseReferenceRateXml(buffer: Buffer): ReferenceRates {
  const text = buffer.toString('utf8').replace(/^\uFEFF/, '');
  if (text.trim() === '') throw validationError({ file: 'The file is empty. Upload the euro reference-rate XML file.' });
  if (DOCTYPE.test(text)) {
    throw validationError({
      file: 'The file declares a DOCTYPE or entities, which the euro reference-rate file never has (they can read local files or expand without end). Nothing was saved; upload the file as published.',
    });
  }
  const valid = XMLValidator.validate(text);
  if (valid !== true) {
    throw validationError({ file: `The file is not well-formed XML (line ${valid.err.line}: ${valid.err.msg}). Upload the euro reference-rate XML file.` });
  }
  let tree: unknown;
  try {
    tree = parser.parse(text);
  } catch (err) {
    const message = (err as Error).message;
    throw validationError({
      file: /nested/i.test(message)
        ? `The elements are nested more than ${MAX_XML_DEPTH} deep; the euro reference-rate file nests four. Nothing was saved.`
        : `The file cannot be read as XML (${message}). Upload the euro reference-rate XML file.`,
    });
  }
  try {
    return referenceRatesFromTree(tree, 'file');
  } catch (err) {
    if (err instanceof RangeError) throw validationError({ file: err.message.replace(/^file: /, '').replace(/^./, (c) => c.toUpperCase()) });
    throw err;
  }
}

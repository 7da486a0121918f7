// Words for the sales tax taken out of a retail price (the cost section and the printed report).
import type { SalesTaxDto } from '@splitcase/contracts';

const plain = (x: number) => String(Number(x.toPrecision(10)));

/** "less 20 % sales tax (workspace default for EUR)", or "quoted before sales tax (set on the device)". */
export function salesTaxText(t: SalesTaxDto): string {
  const from = t.source === 'device' ? 'set on the device' : `workspace default for ${t.currency}`;
  return t.rate === 0 ? `quoted before sales tax (${from})` : `less ${plain(t.rate * 100)} % sales tax (${from})`;
}

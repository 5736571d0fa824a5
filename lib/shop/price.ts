/**
 * A price as the shop shows it: integer cents of an ISO 4217 currency, formatted by the
 * platform's Intl.NumberFormat in the shop's language (English), so "$14.00", "€11.50", "£9.00".
 * Every currency we sell in (PATTERN_CURRENCIES) has two minor digits, so cents ÷ 100 is exact.
 *
 * @example formatPrice(1400, 'USD') // '$14.00'
 */
export function formatPrice(priceCents: number, currency: string): string {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).format(priceCents / 100)
}

/** Cents as dollars for a form field: 12345 -> "123.45". */
export const toDollars = (cents: number) => (cents / 100).toFixed(2);

/** Dollars as typed ("$1,234.50") to cents; NaN when it is not a number (the server's schema says so). */
export const toCents = (text: string) => Math.round(Number(text.replace(/[$,\s]/g, '')) * 100);

// Number cells as people and export tools write them: "1,234.50", "1.234,50", "$12", "-€3.00",
// "(4.00)" for a refund, "<1" for search interest too small to show.

export type NumberCell =
  | { kind: 'blank' }
  | { kind: 'number'; value: number; belowOne: boolean; currency: string | null }
  | { kind: 'invalid' };

const currencySigns: Record<string, string> = { $: 'USD', '€': 'EUR', '£': 'GBP' };
const codes = /^(USD|EUR|GBP|CAD|AUD|NZD|CHF)\s*|\s*(USD|EUR|GBP|CAD|AUD|NZD|CHF)$/i;

/** Removes a currency sign or code at either end, reporting which one it was. */
function stripCurrency(text: string): { rest: string; currency: string | null } {
  let rest = text;
  let currency: string | null = null;
  const code = codes.exec(rest);
  if (code) {
    currency = (code[1] ?? code[2]).toUpperCase();
    rest = rest.replace(codes, '');
  }
  const sign = /^([-−]?)\s*([$€£])\s*|\s*([$€£])$/.exec(rest);
  if (sign) {
    currency = currencySigns[sign[2] ?? sign[3]];
    rest = sign[1] ? sign[1] + rest.slice(sign[0].length) : rest.replace(sign[0], '');
  }
  return { rest: rest.trim(), currency };
}

/**
 * Turns the digits of a cell into a plain "123.45" string. The group separator is dropped only
 * where it really groups three digits, so "12.5" in a decimal-comma file still reads as 12.5.
 */
const groupedWithDot = /^\d{1,3}(,\d{3})+(\.\d*)?$/;
const groupedWithComma = /^\d{1,3}(\.\d{3})+(,\d*)?$/;

function normaliseDigits(text: string, decimalSeparator: '.' | ','): string | null {
  const group = decimalSeparator === '.' ? ',' : '.';
  let body = text.replace(/[\s\u00a0\u202f']/g, '');
  const grouped = decimalSeparator === '.' ? groupedWithDot : groupedWithComma;
  if (grouped.test(body)) {
    body = body.split(group).join('');
  } else if (body.includes(group) && !body.includes(decimalSeparator)) {
    // A lone "other" separator that does not group thousands is a decimal point after all.
    if (body.split(group).length !== 2) return null;
    body = body.replace(group, decimalSeparator);
  }
  if (decimalSeparator === ',') body = body.replace(',', '.');
  return /^(\d+\.?\d*|\.\d+)$/.test(body) ? body : null;
}

const plainWithDot = /^-?\d+(\.\d+)?$/;
const plainWithComma = /^-?\d+(,\d+)?$/;

export function parseNumberCell(text: string, decimalSeparator: '.' | ','): NumberCell {
  let rest = text.trim();
  if (rest === '') return { kind: 'blank' };
  // Most cells are plain numbers: read them without the currency and grouping rules below.
  if ((decimalSeparator === '.' ? plainWithDot : plainWithComma).test(rest)) {
    const value = Number(decimalSeparator === '.' ? rest : rest.replace(',', '.'));
    return { kind: 'number', value: value === 0 ? 0 : value, belowOne: false, currency: null };
  }
  if (/^<\s*1$/.test(rest)) return { kind: 'number', value: 0.5, belowOne: true, currency: null };
  let isNegative = false;
  const accounting = /^\((.*)\)$/.exec(rest);
  if (accounting) {
    isNegative = true;
    rest = accounting[1].trim();
  }
  const stripped = stripCurrency(rest);
  rest = stripped.rest;
  if (/^[-−]/.test(rest)) {
    isNegative = !isNegative;
    rest = rest.slice(1).trim();
  } else if (rest.startsWith('+')) {
    rest = rest.slice(1).trim();
  }
  // A currency sign may also sit after the minus: "-$3.00".
  if (!stripped.currency) {
    const again = stripCurrency(rest);
    rest = again.rest;
    stripped.currency = again.currency;
  }
  const digits = normaliseDigits(rest, decimalSeparator);
  if (digits === null) return { kind: 'invalid' };
  const value = Number(digits) * (isNegative ? -1 : 1);
  if (!Number.isFinite(value)) return { kind: 'invalid' };
  return { kind: 'number', value: value === 0 ? 0 : value, belowOne: false, currency: stripped.currency };
}

/**
 * Money as integer cents, rounded half away from zero from the decimal text itself so that
 * 0.29 never becomes 28 cents through floating point.
 */
export function toCents(value: number): number {
  // Amounts with at most two decimals land within a hair of a whole number of cents.
  const scaled = value * 100;
  const nearest = Math.round(scaled);
  if (Math.abs(scaled - nearest) < 1e-6) return nearest === 0 ? 0 : nearest;
  const sign = value < 0 ? -1 : 1;
  const [whole, fraction = ''] = Math.abs(value).toFixed(6).split('.');
  const cents = Number(whole) * 100 + Number(fraction.slice(0, 2));
  const roundUp = Number(fraction.slice(2)) >= 5000;
  const total = sign * (cents + (roundUp ? 1 : 0));
  return total === 0 ? 0 : total;
}

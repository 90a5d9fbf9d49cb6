import { Refusal } from './refusal';

// Numbers typed into the pane: a blank box is refused (never read as 0) and a decimal comma is accepted.

/** The user's decimal separator, from the browser's locale ('.' where none can be found). */
export function localeDecimalSeparator(locale?: string): string {
  try {
    return new Intl.NumberFormat(locale).formatToParts(1.5).find((p) => p.type === 'decimal')?.value ?? '.';
  } catch {
    return '.';
  }
}

/**
 * One number from a box, named by its label in the message. "4,76" is 4.76; "1,000" is refused where
 * the locale writes a decimal point (it could be a thousand); blank is refused.
 * @example parseStrictNumber('4,76', 'pKa') // 4.76
 */
export function parseStrictNumber(text: string, label: string, decimalSeparator = localeDecimalSeparator()): number {
  const t = text.trim().replace(/[\u2212\u2013]/g, '-');
  if (t === '') throw new Refusal(`${label} is blank: enter a number.`);
  let normalised = t;
  if (t.includes(',')) {
    if (t.includes('.') || (t.match(/,/g) ?? []).length > 1) throw new Refusal(`${label}: “${text.trim()}” mixes separators; write one decimal separator and no thousands separator.`);
    if (decimalSeparator !== ',' && /^-?\d{1,3},\d{3}$/.test(t)) throw new Refusal(`${label}: “${text.trim()}” could be a thousand or a decimal; write it without the comma, or with a point.`);
    normalised = t.replace(',', '.');
  }
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(normalised)) throw new Refusal(`${label}: “${text.trim()}” is not a number.`);
  const value = Number(normalised);
  if (!Number.isFinite(value)) throw new Refusal(`${label}: “${text.trim()}” is not a finite number.`);
  return value;
}

/**
 * A list of numbers: separated by ";", spaces, or a comma followed by a space ("6.1, 9.2"); a comma between
 * digits inside one value is its decimal comma ("4,76; 9,2" is two values).
 * @example parseNumberList('4,76', 'pKa values') // [4.76]
 */
export function parseNumberList(text: string, label: string): number[] {
  const trimmed = text.trim();
  if (trimmed === '') throw new Refusal(`${label}: blank; enter at least one number.`);
  const tokens = trimmed.split(/;|,\s+|\s+/).filter((x) => x !== '');
  // a token like "6.1,9.2" has a point, so its comma separates two values
  const values = tokens.flatMap((tok) => (tok.includes('.') && tok.includes(',') ? tok.split(',') : [tok])).filter((x) => x !== '');
  return values.map((v, i) => parseStrictNumber(v, `${label}, value ${i + 1}`, ','));
}

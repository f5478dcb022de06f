/**
 * Reads a number as a maker types it into a form: a point or a comma for the decimals
 * ("3.8", "3,8"), spaces around it ignored. Anything else — a unit typed after the number
 * ("5 gal", "88F"), a time ("1:20"), words ("a pinch"), thousands separators — is not
 * guessed at: the answer says why, so the field can keep the text and show the reason.
 */
export type NumberReading =
  | { kind: 'empty' }
  /** note: how an ambiguous text was read ("1,250" as 1.25), to show beside the field */
  | { kind: 'number'; value: number; note?: string }
  /** A number still being typed ("3," or "-"): nothing to say yet, nothing to store. */
  | { kind: 'partial' }
  | { kind: 'invalid'; message: string };

const NUMBER = /^[-+]?(\d+([.,]\d*)?|[.,]\d+)$/;
const PARTIAL = /^[-+]?$|^[-+]?\d+[.,]$/;

export function readNumberInput(
  text: string,
  opts: { whole?: boolean; unit?: string } = {},
): NumberReading {
  const t = text.trim();
  if (t === '') return { kind: 'empty' };
  if (PARTIAL.test(t)) return { kind: 'partial' };
  if (NUMBER.test(t)) {
    const value = Number(t.replace(',', '.'));
    if (opts.whole && !Number.isInteger(value))
      return { kind: 'invalid', message: 'Whole numbers only here, without decimals.' };
    // "1,250" is 1.25 with a decimal comma but 1250 with a thousands comma: say which.
    const note = /^[-+]?\d{1,3},\d{3}$/.test(t) ? `Read as ${value} (a decimal comma).` : undefined;
    return note ? { kind: 'number', value, note } : { kind: 'number', value };
  }
  if (/^\d+\s*[:h]\s*\d+/.test(t)) {
    return {
      kind: 'invalid',
      message: 'Type one number: a time as minutes, e.g. 80 for 1 h 20 min.',
    };
  }
  if (/^[-+]?\d+([.,]\d+)?\s*[^\d\s.,:]+/.test(t)) {
    return {
      kind: 'invalid',
      message: opts.unit
        ? `Type the number only: this field is in ${opts.unit} (shown in its label).`
        : 'Type the number only, without a unit: the unit is in the label.',
    };
  }
  if (/^\d{1,3}([.,]\d{3})+([.,]\d+)?$/.test(t) || /\d[.,]\d*[.,]/.test(t)) {
    return {
      kind: 'invalid',
      message: 'Use one decimal point or comma, and no thousands separator (e.g. 1250.5).',
    };
  }
  return {
    kind: 'invalid',
    message: 'This needs a number (e.g. 2.5). Words and amounts like "a pinch" go in the notes.',
  };
}

/** Turns a loaded value back into the text of its field ("" for none). */
export function numberInputText(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '' : String(value);
}

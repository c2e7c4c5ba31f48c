// Text in a cell of the workbook document. The document holds a formula as text starting with
// '=', and the formula engine reads some other text as a value of another kind: "007" and
// "1e3" as numbers, "1/2/2020" and "12:30" as dates and times, "TRUE" as a truth value, "#N/A"
// as an error. Text that would be read as anything but itself is stored with a leading
// apostrophe, the mark spreadsheet programs use for "this is text": the engine shows it without
// the apostrophe, and every reader of the document takes the apostrophe off again.

/**
 * Numbers, percentages, currency, dates and times ("+5", ".5", "$5", "50%", "007", "1e3",
 * "1/2/2020", "1.5.20", "12:30") are digits or a colon among these characters, nothing else; a
 * time may also hold am/pm ("12:30 pm", "1:a"). Tags such as "10-P-101" or "2A" hold a letter and
 * stay as typed.
 */
const NUMBER_LIKE = /^[\d\s.,:/\-+$%eE]*[\d:][\d\s.,:/\-+$%eE]*$/;
const TIME_OF_DAY = /^(?=.*:)[\d\s.,:/\-+$%eEaApPmM]*$/;

/** Would the engine read this text as something other than the text itself? (Errs on the safe side.) */
export function needsTextMark(text: string): boolean {
  if (text.startsWith('=') || text.startsWith("'")) return true;
  const t = text.trim();
  if (t === '') return text !== '';
  // Error values ("#N/A", "#REF!") start with '#'.
  if (t.startsWith('#') || NUMBER_LIKE.test(t) || TIME_OF_DAY.test(t)) return true;
  const upper = t.toUpperCase();
  return upper === 'TRUE' || upper === 'FALSE';
}

/** The cell content that shows exactly `text`. */
export function textContent(text: string): string {
  return needsTextMark(text) ? `'${text}` : text;
}

/** The text a text cell shows: its content without the leading apostrophe, if it has one. */
export function shownText(content: string): string {
  return content.startsWith("'") ? content.slice(1) : content;
}

// Text a spreadsheet file can carry and bring back unchanged. XML 1.0, inside every xlsx, cannot
// hold control characters, half of a surrogate pair, U+FFFE or U+FFFF; a name holding one would
// come back altered (or not at all), so such names are refused where they are typed.

/** Control characters (tab, line breaks and DEL too: no name needs them), unpaired surrogates, non-characters. */
const UNSTORABLE =
  // eslint-disable-next-line no-control-regex -- control characters are what this finds
  /[\u0000-\u001F\u007F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The first character of `text` a file cannot carry, as "U+0007", or undefined when there is none. */
export function unstorableCharacter(text: string): string | undefined {
  const m = UNSTORABLE.exec(text);
  if (!m) return undefined;
  return `U+${(m[0].codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;
}

// Where JSON text first breaks the grammar (RFC 8259), as an offset. JSON.parse does not always
// say (Node reports a position for some errors, a snippet for others), and an estimator editing a
// site file by hand needs the line and character.

/** Thrown inside the scanner to unwind to the offset where the grammar broke. */
class PositionError extends Error {
  constructor(readonly offset: number) {
    super(`JSON syntax error at offset ${offset}`);
  }
}

/** Offset of the first syntax error, or undefined when the text is valid JSON. */
export function jsonErrorOffset(text: string): number | undefined {
  let i = 0;
  const ws = () => {
    while (i < text.length && ' \t\n\r'.includes(text[i] as string)) i++;
  };
  const fail = (): never => {
    throw new PositionError(i);
  };
  const literal = (word: string) => {
    for (const ch of word)
      if (text[i++] !== ch) {
        i--;
        fail();
      }
  };
  const string = () => {
    i++;
    for (;;) {
      const ch = text[i];
      if (ch === undefined || ch < ' ') fail();
      if (ch === '"') return void i++;
      if (ch === '\\') {
        i++;
        const e = text[i];
        if (e === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail();
          i += 4;
        } else if (e === undefined || !'"\\/bfnrt'.includes(e)) fail();
      }
      i++;
    }
  };
  const number = () => {
    const m = /^-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/.exec(text.slice(i));
    if (!m || m[0] === '-' || m[0] === '') fail();
    i += (m as RegExpExecArray)[0].length;
  };
  const value = (): void => {
    ws();
    const ch = text[i];
    if (ch === '{')
      return members('}', () => {
        ws();
        if (text[i] !== '"') fail();
        string();
        ws();
        if (text[i] !== ':') fail();
        i++;
        value();
      });
    if (ch === '[') return members(']', value);
    if (ch === '"') return string();
    if (ch === 't') return literal('true');
    if (ch === 'f') return literal('false');
    if (ch === 'n') return literal('null');
    number();
  };
  const members = (close: string, item: () => void) => {
    i++;
    ws();
    if (text[i] === close) return void i++;
    for (;;) {
      item();
      ws();
      if (text[i] === ',') i++;
      else if (text[i] === close) return void i++;
      else fail();
    }
  };
  try {
    value();
    ws();
    if (i < text.length) fail();
    return undefined;
  } catch (at) {
    if (at instanceof PositionError) return at.offset;
    throw at;
  }
}

/** "line L, character C" (1-based) of an offset in text. */
export function lineAndCharacter(text: string, offset: number): string {
  const before = text.slice(0, offset);
  return `line ${before.split('\n').length}, character ${offset - before.lastIndexOf('\n')}`;
}

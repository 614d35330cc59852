/**
 * Finds where a JSON path (["betas", 2]) sits in JSON text, so a spec issue can point at its
 * place in the editor; and turns JSON.parse's complaint into a line and column.
 */

/** [start, end) offsets of the value at `path` (or of the deepest existing parent), or null. */
export function locateJsonPath(text: string, path: ReadonlyArray<string | number>): [number, number] | null {
  let i = 0;
  const ws = () => { while (i < text.length && /\s/.test(text[i])) i++; };
  const skipString = () => {
    i++;
    while (i < text.length && text[i] !== '"') i += text[i] === '\\' ? 2 : 1;
    i++;
  };
  const readString = (): string => {
    const start = i;
    skipString();
    try { return JSON.parse(text.slice(start, i)) as string; } catch { return ''; }
  };
  /** Skips one value; returns its [start, end). */
  const skipValue = (): [number, number] => {
    ws();
    const start = i;
    const c = text[i];
    if (c === '"') skipString();
    else if (c === '{' || c === '[') {
      const close = c === '{' ? '}' : ']';
      i++;
      ws();
      while (i < text.length && text[i] !== close) {
        if (c === '{') { ws(); skipString(); ws(); i++; }
        skipValue();
        ws();
        if (text[i] === ',') i++;
        ws();
      }
      i++;
    } else {
      while (i < text.length && !/[\s,\]}]/.test(text[i])) i++;
    }
    return [start, i];
  };
  /** Descends into the value at i following path[depth..]. */
  const descend = (depth: number): [number, number] | null => {
    ws();
    if (depth === path.length) return i < text.length ? skipValue() : null;
    const key = path[depth];
    const c = text[i];
    if (c === '{' && typeof key === 'string') {
      i++;
      ws();
      while (i < text.length && text[i] !== '}') {
        ws();
        const k = readString();
        ws();
        i++; // colon
        if (k === key) return descend(depth + 1);
        skipValue();
        ws();
        if (text[i] === ',') i++;
        ws();
      }
      return null;
    }
    if (c === '[' && typeof key === 'number') {
      i++;
      for (let n = 0; i < text.length && text[i] !== ']'; n++) {
        ws();
        if (n === key) return descend(depth + 1);
        skipValue();
        ws();
        if (text[i] === ',') i++;
        ws();
      }
      return null;
    }
    // The path goes deeper than the value's shape allows.
    return null;
  };
  try {
    return descend(0) ?? (path.length ? locateJsonPath(text, path.slice(0, -1)) : null);
  } catch {
    return null;
  }
}

/** 1-based line and column of an offset. */
export function lineColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - before.lastIndexOf('\n') };
}

/**
 * Offset of the first error in JSON text (where a strict parser stops), or null when the text
 * is valid JSON. JSON.parse's messages differ between engines (some give no position), so
 * the page finds the place itself.
 */
export function jsonErrorOffset(text: string): number | null {
  let i = 0;
  const fail = (): never => { throw i; };
  const ws = () => { while (i < text.length && ' \t\n\r'.includes(text[i])) i++; };
  const literal = (word: string) => { for (const ch of word) { if (text[i] !== ch) fail(); i++; } };
  const string = () => {
    i++;
    for (;;) {
      if (i >= text.length) fail();
      const c = text[i];
      if (c === '"') { i++; return; }
      if (c < ' ') fail();
      if (c === '\\') {
        i++;
        if (text[i] === 'u') { for (let k = 1; k <= 4; k++) if (!/[0-9a-fA-F]/.test(text[i + k] ?? '')) { i += k; fail(); } i += 5; continue; }
        if (!'"\\/bfnrt'.includes(text[i] ?? 'x')) fail();
      }
      i++;
    }
  };
  const number = () => {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i));
    if (!m) fail();
    i += m![0].length;
  };
  const value = (): void => {
    ws();
    const c = text[i];
    if (c === '{') {
      i++; ws();
      if (text[i] === '}') { i++; return; }
      for (;;) {
        ws();
        if (text[i] !== '"') fail();
        string(); ws();
        if (text[i] !== ':') fail();
        i++; value(); ws();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === '}') { i++; return; }
        fail();
      }
    }
    if (c === '[') {
      i++; ws();
      if (text[i] === ']') { i++; return; }
      for (;;) {
        value(); ws();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === ']') { i++; return; }
        fail();
      }
    }
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    if (c === '-' || (c >= '0' && c <= '9')) return number();
    fail();
  };
  try {
    value();
    ws();
    return i < text.length ? i : null;
  } catch (at) {
    return typeof at === 'number' ? Math.min(at, text.length) : 0;
  }
}

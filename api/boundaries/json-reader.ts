/**
 * A JSON reader for boundary files that never holds the event loop for long and refuses
 * hostile shapes early:
 * - the file (already capped in size by the multipart step) is read as text and parsed
 *   by an explicit-stack state machine, in slices of `sliceChars` characters, yielding to
 *   the event loop between slices (setImmediate), so other requests keep being answered
 *   while a 50 MB file is read;
 * - nesting deeper than `maxDepth` is refused at the byte it happens (GeoJSON polygons
 *   need 7 levels: collection, features, feature, geometry, coordinates, ring, position);
 * - an array longer than `maxArray` items is refused when it reaches that length (a
 *   giant coordinate array stops at 100,001 positions, not after 50 MB);
 * - a string longer than `maxString` characters is refused.
 * Errors name the line and column.
 *
 * Boundary uploads run it in a compute pool thread (read-file.ts); the slices keep it fair
 * to the other tasks there, and to the event loop where it runs inline (the demo seed).
 */
import fs from 'node:fs/promises';

export interface JsonLimits {
  maxDepth: number;
  maxArray: number;
  maxString: number;
  sliceChars: number;
}

export const DEFAULT_JSON_LIMITS: JsonLimits = {
  maxDepth: 12,
  maxArray: 100_001,
  maxString: 100_000,
  sliceChars: 256 * 1024,
};

export class JsonReadError extends Error {
  constructor(
    readonly reason: string,
    readonly line: number,
    readonly column: number,
  ) {
    super(`line ${line}, column ${column}: ${reason}`);
  }
}

type Frame = { array: unknown[]; key?: undefined } | { object: Record<string, unknown>; key: string | null };

const enum State {
  Value,
  ValueOrEnd,
  KeyOrEnd,
  Key,
  Colon,
  CommaOrEnd,
  Done,
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;

function position(text: string, at: number): { line: number; column: number } {
  let line = 1;
  let last = -1;
  for (let i = text.indexOf('\n'); i !== -1 && i < at; i = text.indexOf('\n', i + 1)) {
    line += 1;
    last = i;
  }
  return { line, column: at - last };
}

const tick = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Parses JSON text in slices; see the module comment. */
export async function parseJsonText(text: string, limits: JsonLimits = DEFAULT_JSON_LIMITS): Promise<unknown> {
  const fail = (reason: string, at: number): never => {
    const p = position(text, at);
    throw new JsonReadError(reason, p.line, p.column);
  };
  const stack: Frame[] = [];
  let state = State.Value as State;
  let root: unknown;
  let pos = 0;
  const n = text.length;
  let sliceEnd = limits.sliceChars;

  const readString = (): string => {
    const start = pos;
    let i = pos + 1;
    let escaped = false;
    for (;;) {
      const q = text.indexOf('"', i);
      if (q === -1) fail('a text value is not closed by a quote', start);
      let b = q - 1;
      let slashes = 0;
      while (text.charCodeAt(b) === 92) {
        slashes += 1;
        b -= 1;
      }
      if (slashes > 0) escaped = true;
      if (slashes % 2 === 0) {
        i = q;
        break;
      }
      i = q + 1;
    }
    if (i - start - 1 > limits.maxString)
      fail(`a text value is longer than ${limits.maxString.toLocaleString('en')} characters`, start);
    const raw = text.slice(start + 1, i);
    pos = i + 1;
    for (let k = 0; k < raw.length; k++)
      if (raw.charCodeAt(k) < 0x20) fail('a control character inside a text value', start + 1 + k);
    if (!escaped) return raw;
    try {
      return JSON.parse(`"${raw}"`) as string;
    } catch {
      return fail('a bad escape sequence inside a text value', start);
    }
  };

  const emit = (v: unknown): void => {
    const top = stack[stack.length - 1];
    if (!top) {
      root = v;
      state = State.Done;
      return;
    }
    if ('array' in top) {
      if (top.array.length >= limits.maxArray)
        fail(`an array has more than ${(limits.maxArray - 1).toLocaleString('en')} items`, pos);
      top.array.push(v);
    } else {
      Object.defineProperty(top.object, top.key!, { value: v, enumerable: true, writable: true, configurable: true });
      top.key = null;
    }
    state = State.CommaOrEnd;
  };

  const open = (frame: Frame): void => {
    if (stack.length >= limits.maxDepth) fail(`nesting deeper than ${limits.maxDepth} levels`, pos);
    stack.push(frame);
    pos += 1;
  };

  while (pos < n) {
    if (pos >= sliceEnd) {
      await tick();
      sliceEnd = pos + limits.sliceChars;
    }
    const c = text.charCodeAt(pos);
    if (c === 32 || c === 10 || c === 13 || c === 9) {
      pos += 1;
      continue;
    }
    switch (state) {
      case State.Done:
        fail('more text after the end of the JSON value', pos);
        break;
      case State.Colon:
        if (c !== 58) fail('expected ":" after a member name', pos);
        pos += 1;
        state = State.Value;
        break;
      case State.KeyOrEnd:
      case State.Key: {
        if (c === 125 && state === State.KeyOrEnd) {
          pos += 1;
          emit((stack.pop() as { object: unknown }).object);
          break;
        }
        if (c !== 34) fail('expected a member name in quotes', pos);
        (stack[stack.length - 1] as { key: string | null }).key = readString();
        state = State.Colon;
        break;
      }
      case State.CommaOrEnd: {
        const top = stack[stack.length - 1];
        if (c === 44) {
          pos += 1;
          state = 'array' in top ? State.Value : State.Key;
        } else if (c === 93 && 'array' in top) {
          pos += 1;
          emit((stack.pop() as { array: unknown }).array);
        } else if (c === 125 && 'object' in top) {
          pos += 1;
          emit((stack.pop() as { object: unknown }).object);
        } else {
          fail(`expected "," or "${'array' in top ? ']' : '}'}"`, pos);
        }
        break;
      }
      case State.ValueOrEnd:
        if (c === 93) {
          pos += 1;
          emit((stack.pop() as { array: unknown }).array);
        } else {
          state = State.Value;
        }
        break;
      case State.Value: {
        if (c === 123) {
          open({ object: {}, key: null });
          state = State.KeyOrEnd;
        } else if (c === 91) {
          open({ array: [] });
          state = State.ValueOrEnd;
        } else if (c === 34) {
          emit(readString());
        } else if (c === 45 || (c >= 48 && c <= 57)) {
          NUMBER.lastIndex = pos;
          const m = NUMBER.exec(text);
          if (!m) fail('a badly written number', pos);
          pos += m![0].length;
          emit(Number(m![0]));
        } else if (text.startsWith('true', pos)) {
          pos += 4;
          emit(true);
        } else if (text.startsWith('false', pos)) {
          pos += 5;
          emit(false);
        } else if (text.startsWith('null', pos)) {
          pos += 4;
          emit(null);
        } else {
          fail(`unexpected character "${text[pos]}"`, pos);
        }
        break;
      }
    }
  }
  if (state !== State.Done)
    fail(stack.length ? 'the file ends inside an object or array' : 'the file holds no JSON value', n);
  return root;
}

/** Reads a file as UTF-8 (dropping a byte-order mark) and parses it with parseJsonText. */
export async function readJsonFile(path: string, limits?: JsonLimits): Promise<unknown> {
  let text = await fs.readFile(path, 'utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  return parseJsonText(text, limits);
}

/**
 * JSON.stringify(value, replacer, space) + "\n", the same bytes, given out in chunks of about
 * CHUNK characters: a report of hundreds of thousands of results is longer than the longest
 * string V8 can make (about 2^29 characters), so the command line writes it piece by piece.
 * Containers down to STREAM_DEPTH are walked here, key by key and element by element; a value
 * below is one JSON.stringify call, re-indented when indented (JSON strings hold no raw line
 * break, so every "\n" in its output starts an indented line), unless its text is longer than a
 * chunk (a checklist item lists every result): then it is walked too. Nesting is shallow, so each
 * part is stringified a bounded number of times: linear. Serialisation only: nothing is computed.
 */

/** Chunks are cut once the pending text reaches this many characters. */
export const CHUNK = 64 * 1024;

/**
 * The depth to which containers are walked here: a run (0), its files (1), a file (2), a file's
 * results and findings (3), so each result or finding (4) is one JSON.stringify call.
 */
const STREAM_DEPTH = 4;

type Replacer = (key: string, value: unknown) => unknown;

/** `space`: spaces per level of indentation, 0 for none (then no line breaks but the last), as JSON.stringify's. */
export function* jsonChunks(value: unknown, replacer: Replacer, chunk = CHUNK, space = 2): Generator<string> {
  const step = ' '.repeat(space);
  // between an object's key and its value: ": " when indented, ":" when not, as JSON.stringify writes
  const colon = space > 0 ? ': ' : ':';
  let pending: string[] = [];
  let size = 0;
  const put = function* (s: string): Generator<string> {
    pending.push(s);
    size += s.length;
    if (size >= chunk) {
      yield pending.join('');
      pending = [];
      size = 0;
    }
  };

  /** The value as JSON.stringify sees it for this key: toJSON, then the replacer. */
  const prepare = (holder: unknown, key: string, v: unknown): unknown => {
    let out = v;
    if (out !== null && typeof out === 'object' && typeof (out as { toJSON?: unknown }).toJSON === 'function') out = (out as { toJSON: (k: string) => unknown }).toJSON(key);
    return replacer.call(holder, key, out);
  };

  /** Writes a prepared value at `indent`; false when JSON would leave it out (undefined, a function, a symbol). */
  const write = function* (v: unknown, indent: string, depth: number): Generator<string, boolean> {
    if (v === null || typeof v !== 'object' || depth >= STREAM_DEPTH) {
      let text: string | undefined;
      try {
        text = JSON.stringify(v, replacer, space) as string | undefined;
      } catch (e) {
        // longer than any string can be: walked below, piece by piece
        if (!(e instanceof RangeError) || v === null || typeof v !== 'object') throw e;
        text = '';
      }
      if (text === undefined) return false;
      if (v === null || typeof v !== 'object' || (text.length > 0 && text.length <= chunk)) {
        yield* put(indent === '' ? text : text.replaceAll('\n', `\n${indent}`));
        return true;
      }
    }
    const inner = `${indent}${step}`;
    // what starts an element or member, and what closes the container: a line break and indentation, or nothing
    const open = space > 0 ? `\n${inner}` : '';
    const close = space > 0 ? `\n${indent}` : '';
    if (Array.isArray(v)) {
      if (v.length === 0) {
        yield* put('[]');
        return true;
      }
      yield* put('[');
      for (let i = 0; i < v.length; i += 1) {
        yield* put(i === 0 ? open : `,${open}`);
        // an element JSON leaves out of an object is null in an array
        if (!(yield* write(prepare(v, String(i), v[i]), inner, depth + 1))) yield* put('null');
      }
      yield* put(`${close}]`);
      return true;
    }
    let first = true;
    for (const key of Object.keys(v)) {
      const item = prepare(v, key, (v as Record<string, unknown>)[key]);
      const text = item === undefined || typeof item === 'function' || typeof item === 'symbol' ? undefined : item;
      if (text === undefined) continue;
      yield* put(`${first ? '{' : ','}${open}${JSON.stringify(key)}${colon}`);
      first = false;
      yield* write(item, inner, depth + 1);
    }
    yield* put(first ? '{}' : `${close}}`);
    return true;
  };

  yield* write(prepare({ '': value }, '', value), '', 0);
  pending.push('\n');
  yield pending.join('');
}

/**
 * Splits a byte stream into NDJSON records as the bytes arrive: at most one partial line is
 * held, so a stream of a million samples is read in constant memory.
 */
export async function* ndjsonRecords<T>(chunks: AsyncIterable<Uint8Array>): AsyncGenerator<T> {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let pending = '';
  for await (const chunk of chunks) {
    pending += decoder.decode(chunk, { stream: true });
    let from = 0;
    for (let newline = pending.indexOf('\n'); newline >= 0; newline = pending.indexOf('\n', from)) {
      const line = pending.slice(from, newline);
      from = newline + 1;
      if (line.trim()) yield JSON.parse(line) as T;
    }
    pending = pending.slice(from);
  }
  pending += decoder.decode();
  if (pending.trim()) yield JSON.parse(pending) as T;
}

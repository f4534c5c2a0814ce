// Reads a Server-Sent Events body as it arrives: each event's JSON data, with the
// moment it arrived, and the raw text (comment lines and ids included). Resolves
// when the stream ends or is cut.
export async function readSse(
  body: ReadableStream<Uint8Array>,
  on: { event?: (data: unknown, at: number) => void; text?: (chunk: string) => void },
): Promise<void> {
  const reader = body.getReader();
  const dec = new TextDecoder();
  let buf = '';
  for (;;) {
    const { value, done } = await reader.read().catch(() => ({ value: undefined, done: true as const }));
    if (done || !value) return;
    const at = performance.now();
    const chunk = dec.decode(value, { stream: true });
    on.text?.(chunk);
    buf += chunk;
    const blocks = buf.split(/\r?\n\r?\n/);
    buf = blocks.pop()!;
    for (const block of blocks) {
      const data = block
        .split(/\r?\n/)
        .filter((l) => l.startsWith('data:'))
        .map((l) => l.slice(5).trimStart())
        .join('\n');
      if (data) on.event?.(JSON.parse(data), at);
    }
  }
}

import { describe, expect, it } from 'vitest';
import { remembered } from '@/lib/remembered';

describe('remembered', () => {
  it('computes a key once, and concurrent asks for it share that one computation', async () => {
    const memo = remembered<string>({ maxBytes: 100, sizeOf: (v) => v.length });
    let runs = 0;
    const compute = async () => {
      runs += 1;
      await new Promise((r) => setTimeout(r, 5));
      return 'thumbnail';
    };
    const answers = await Promise.all([memo.get('p1:7', compute), memo.get('p1:7', compute), memo.get('p1:7', compute)]);
    expect(answers).toEqual(['thumbnail', 'thumbnail', 'thumbnail']);
    expect(await memo.get('p1:7', compute)).toBe('thumbnail');
    expect(runs).toBe(1);
  });

  it('stays within its byte budget, letting the least recently used go first; a value over the budget is answered, not kept', async () => {
    const memo = remembered<string>({ maxBytes: 30, sizeOf: (v) => v.length });
    const runs = new Map<string, number>();
    const ask = (key: string, value = key.repeat(10)) =>
      memo.get(key, async () => {
        runs.set(key, (runs.get(key) ?? 0) + 1);
        return value;
      });
    await ask('a'); // 10 bytes each: a, b, c fill the budget
    await ask('b');
    await ask('c');
    await ask('a'); // a is used again: b is now the least recently used
    await ask('d'); // over budget: b goes
    await ask('a');
    await ask('c');
    await ask('d');
    await ask('b');
    expect(Object.fromEntries(runs)).toEqual({ a: 1, b: 2, c: 1, d: 1 });
    const huge = 'x'.repeat(31);
    expect(await ask('huge', huge)).toBe(huge);
    expect(await ask('huge', huge)).toBe(huge);
    expect(runs.get('huge')).toBe(2);
  });

  it('keeps a null answer (nothing to show) like any other', async () => {
    const memo = remembered<string | null>({ maxBytes: 10, sizeOf: (v) => v?.length ?? 0 });
    let runs = 0;
    const compute = async () => {
      runs += 1;
      return null;
    };
    expect(await memo.get('gone', compute)).toBeNull();
    expect(await memo.get('gone', compute)).toBeNull();
    expect(runs).toBe(1);
  });
});

// @vitest-environment jsdom
// The volume's preflight panel in the DOM: the book's checks and every page's in running order,
// each level in words (never colour alone), each rule's source beside its message, and the
// caution that the printer's own specification takes precedence. The book's checks are the pure
// module's own (bookPreflight), the answer comes through the panel's SWR key as on the volume page.
import { cleanup, render, screen, within } from '@testing-library/react';
import { SWRConfig } from 'swr';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { PreflightView } from '@/components/volume/preflight-view';
import type { EntryDto } from '@/db/queries/volumes';
import { entry as placedEntry } from '../support/entries';
import type { VolumePreflight } from '@/lib/export/volume-preflight';
import { bookPreflight } from '@/lib/print/preflight';
import { PRINTER_FIRST, SOURCES, resolutionCheck } from '@/lib/print/preflight-rules';

afterEach(cleanup);

const entry = (id: string, kind: EntryDto['kind'], title: string | null = null) => placedEntry(id, kind, title, 'inked');
const ENTRIES = [
  entry('e1', 'cover'),
  entry('e2', 'gag', 'Kettle Crab'),
  entry('e3', 'gag', 'Low Tide'),
  entry('e4', 'afterword'),
  entry('e5', 'back-cover'),
];

// Five pages, perfect bound, page 3 without its scan: the page count warns, the spine is fine, the missing page fails.
const BOOK = bookPreflight({ kinds: ENTRIES.map((e) => e.kind), binding: 'perfect', caliperUm: 120, missing: [3] });
const PREFLIGHT: VolumePreflight = {
  note: PRINTER_FIRST,
  pages: [
    { number: 1, entryId: 'e1', kind: 'cover', ppi: { x: 300.4, y: 300.4 }, level: 'ok', checks: [resolutionCheck({ x: 300.4, y: 300.4 }, 'grey')] },
    {
      number: 2,
      entryId: 'e2',
      gagId: 'g-e2',
      kind: 'gag',
      ppi: { x: 150, y: 149.6 },
      level: 'warn',
      checks: [
        resolutionCheck({ x: 150, y: 149.6 }, 'grey'),
        { rule: 'cut-band', level: 'warn', message: 'May be cut: ink 2.0 mm from the trim on the bottom.', source: SOURCES.cutBand },
      ],
    },
    {
      number: 3,
      entryId: 'e3',
      gagId: 'g-e3',
      kind: 'gag',
      ppi: null,
      level: 'fail',
      checks: [{ rule: 'missing', level: 'fail', message: 'No final page yet.', source: SOURCES.missing }],
    },
    { number: 4, entryId: 'e4', kind: 'afterword', ppi: { x: 600, y: 600 }, level: 'ok', checks: [resolutionCheck({ x: 600, y: 600 }, 'line')] },
    { number: 5, entryId: 'e5', kind: 'back-cover', ppi: { x: 300, y: 300 }, level: 'ok', checks: [resolutionCheck({ x: 300, y: 300 }, 'grey')] },
  ],
  book: BOOK,
};

beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(JSON.stringify(PREFLIGHT), { headers: { 'content-type': 'application/json' } })),
  );
});

/** A check as read: its level in words (the bold lead), its message, and its source (shown in brackets, in full on hover). */
function read(li: HTMLElement) {
  const level = li.querySelector('strong')!.textContent;
  const source = li.querySelector('span[title]')!;
  expect(source.textContent).toBe(`(${source.getAttribute('title')})`);
  const message = li.textContent!.slice(level!.length, li.textContent!.length - source.textContent!.length).trim();
  return { level, message, source: source.getAttribute('title') };
}

function show() {
  return render(
    <SWRConfig value={{ provider: () => new Map(), fallback: { '/api/volumes/v1/preflight': PREFLIGHT } }}>
      <PreflightView volumeId="v1" entries={ENTRIES} />
    </SWRConfig>,
  );
}

describe('PreflightView', () => {
  it("shows the book's checks with their levels in words and their sources, and the printer-first caution", () => {
    show();
    expect(BOOK.level).toBe('fail');
    expect(screen.getByTestId('book-level').textContent!.trim()).toBe('The book: Must fix');
    const book = within(screen.getByRole('list', { name: 'Preflight of the book' })).getAllByRole('listitem');
    expect(book.map((li) => [li.dataset.rule, li.dataset.level])).toEqual([
      ['page-count', 'warn'],
      ['spine', 'ok'],
      ['missing', 'fail'],
    ]);
    const [count, spine, missing] = book.map(read);
    expect(count).toMatchObject({ level: 'Warning:', source: SOURCES.pageCount });
    expect(count!.message).toMatch(
      /^5 pages cannot be perfect bound \(it takes an even count\): the print file adds 1 blank page after page 3.*Printers differ: confirm with yours\./,
    );
    expect(spine).toMatchObject({ level: 'OK:', source: SOURCES.spine });
    expect(spine!.message).toMatch(/^Spine 0\.36 mm at 6 pages on 120 µm paper\. Confirm the width with your printer/);
    expect(missing).toMatchObject({ level: 'Must fix:', source: SOURCES.missing });
    expect(missing!.message).toMatch(/^No final page yet on page 3/);
    // The caution: in the figures' own messages and once under the list.
    expect(count!.message.endsWith(PRINTER_FIRST)).toBe(true);
    expect(spine!.message.endsWith(PRINTER_FIRST)).toBe(true);
    expect(screen.getByText(PRINTER_FIRST, { selector: 'p' })).toBeTruthy();
    expect(PRINTER_FIRST).toBe("The printer's own specification takes precedence.");
  });

  it('lists every page in running order with its label, worst level in words and lower ppi, and its checks with sources', () => {
    show();
    const pages = screen.getAllByTestId('preflight-page');
    expect(pages.map((p) => p.dataset.level)).toEqual(['ok', 'warn', 'fail', 'ok', 'ok']);
    expect(pages.map((p) => p.querySelector('summary')!.textContent)).toEqual([
      '1CoverOK · 300 ppi',
      '2Kettle CrabWarning · 150 ppi',
      '3Low TideMust fix',
      '4AfterwordOK · 600 ppi',
      '5Back coverOK · 300 ppi',
    ]);
    const second = within(within(pages[1]!).getByRole('list', { name: 'Preflight of page 2' })).getAllByRole('listitem');
    expect(second.map((li) => [li.dataset.rule, li.dataset.level])).toEqual([
      ['resolution', 'warn'],
      ['cut-band', 'warn'],
    ]);
    expect(second.map(read)).toEqual([
      {
        level: 'Warning:',
        message: 'Only 150 ppi at the fitted size; greyscale tone wants 300 ppi or more. Rescan at a higher resolution or print it smaller.',
        source: SOURCES.resolution,
      },
      { level: 'Warning:', message: 'May be cut: ink 2.0 mm from the trim on the bottom.', source: SOURCES.cutBand },
    ]);
    const third = within(pages[2]!).getByRole('list', { name: 'Preflight of page 3' });
    expect(read(within(third).getByRole('listitem'))).toEqual({ level: 'Must fix:', message: 'No final page yet.', source: SOURCES.missing });
  });
});

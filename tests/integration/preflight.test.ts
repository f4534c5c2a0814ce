// The volume preflight end to end: scans made with sharp go through the upload pipeline, are
// measured in the worker pool once (kept per final page), and the JSON names each page's figures
// and checks. Sizes: the demo page, 150 mm trim, 3 mm bleed, 5 mm safe; 1 in = 25.4 mm; the ppi
// targets are common practice (line art 600, greyscale 300).
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import * as fitRoute from '@/app/api/final-pages/[finalPageId]/fit/route';
import * as pagePreflightRoute from '@/app/api/final-pages/[finalPageId]/preflight/route';
import * as gagFinalRoute from '@/app/api/gags/[gagId]/final-pages/route';
import * as preflightRoute from '@/app/api/volumes/[volumeId]/preflight/route';
import { createGag } from '@/db/queries/gags';
import { addEntry, createVolume } from '@/db/queries/volumes';
import { heavyTasksCompleted } from '@/lib/workers/pool';
import { callRoute } from '../support/call-route';
import { form, greyTiff, lineArtTiff, rgbPng } from '../support/scans';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID } from '../support/test-db';

const env = useS3AndDb();
const PAGE = { w: 156, h: 156 }; // trim + bleed
const FRAMES = [
  { x: 8, y: 8, w: 140, h: 0.4 },
  { x: 8, y: 147.6, w: 140, h: 0.4 },
  { x: 8, y: 8, w: 0.4, h: 140 },
  { x: 147.6, y: 8, w: 0.4, h: 140 },
];

type Check = { rule: string; level: string; message: string; source: string };

async function gagWith(scan: Buffer, name: string) {
  const gagId = randomUUID();
  await createGag(env.db(), { id: gagId, seriesId: DEMO_SERIES_ID, title: name, premise: '', status: 'inked' });
  const up = await callRoute(gagFinalRoute.POST, {
    method: 'POST',
    as: 'cocreator',
    params: { gagId },
    form: form(scan, `${name}.tif`, 'image/tiff'),
  });
  expect(up.status).toBe(201);
  return { gagId, finalPageId: up.body.id as string };
}

describe('GET /api/volumes/:volumeId/preflight', () => {
  it('every page with its figures and checks, and the book; measured once, then kept', async () => {
    const db = env.db();
    const v = await createVolume(db, { seriesId: DEMO_SERIES_ID, title: 'Preflight', deadline: '2027-03-13' });
    const title = await addEntry(db, v.id, DEMO_SERIES_ID, { kind: 'title' });
    const line = await gagWith(await lineArtTiff({ ...PAGE, ppi: 600, marks: FRAMES }), 'line600');
    const tone = await gagWith(await greyTiff({ ...PAGE, ppi: 300, tone: 215, marks: FRAMES }), 'grey300');
    const soft = await gagWith(await greyTiff({ ...PAGE, ppi: 150, tone: 215, marks: FRAMES }), 'soft150');
    const red = await gagWith(await rgbPng({ ...PAGE, ppi: 300, marks: [...FRAMES, { x: 43, y: 63, w: 10, h: 10, colour: '#d01010' }] }), 'red');
    // Drawn to the trim (150 mm) with a dark background to its edges: it stops at the trim.
    const trimOnly = await gagWith(await greyTiff({ w: 150, h: 150, ppi: 300, tone: 90 }), 'trim');
    // A caption 2 mm from the trim's bottom edge (on the scan: 3 mm of bleed, so 151 mm down).
    const band = await gagWith(await lineArtTiff({ ...PAGE, ppi: 600, marks: [...FRAMES, { x: 60, y: 150, w: 30, h: 1.5 }] }), 'band');
    for (const g of [line, tone, soft, red, trimOnly, band]) await addEntry(db, v.id, DEMO_SERIES_ID, { gagId: g.gagId });

    const before = heavyTasksCompleted();
    const r = await callRoute(preflightRoute.GET, { as: 'viewer', params: { volumeId: v.id } });
    expect(r.status).toBe(200);
    const measured = heavyTasksCompleted() - before;
    expect(measured).toBeLessThanOrEqual(6); // at most one per scan (an upload may have started some already)
    const { pages, book, note } = r.body as { pages: any[]; book: any; note: string };
    expect(note).toMatch(/printer's own specification takes precedence/);
    expect(pages.map((p) => p.number)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    for (const p of pages)
      for (const c of p.checks as Check[]) for (const k of ['rule', 'level', 'message', 'source'] as const) expect(typeof c[k]).toBe('string');
    const by = (gagId: string) => pages.find((p) => p.gagId === gagId);
    const checks = (gagId: string, rule: string) => (by(gagId).checks as Check[]).filter((c) => c.rule === rule);

    expect(pages[0]).toMatchObject({ entryId: title.id, ppi: null, level: 'fail', checks: [{ rule: 'missing', level: 'fail' }] });
    // 3685 px over 156 mm = 600.08 ppi; 1843 px → 300.08; 921 → 149.96 (whole pixels from 156 / 25.4 × ppi).
    expect(by(line.gagId)).toMatchObject({ finalPageId: line.finalPageId, level: 'ok' });
    expect(by(line.gagId).ppi.x).toBeCloseTo(3685 / (156 / 25.4), 6);
    expect(by(line.gagId).ppi.y).toBeCloseTo(3685 / (156 / 25.4), 6);
    expect(by(tone.gagId).level).toBe('ok');
    expect(by(tone.gagId).ppi.x).toBeCloseTo(1843 / (156 / 25.4), 6);
    expect(checks(soft.gagId, 'resolution')[0]).toMatchObject({ level: 'warn', message: expect.stringMatching(/Only 150 ppi/) });
    const colour = checks(red.gagId, 'colour')[0]!;
    expect(colour.level).toBe('warn');
    // The red square: 43–53 mm across and 63–73 mm down the scan, 3 mm of bleed → 40–50 and 60–70 mm on the page.
    const where = colour.message
      .match(/within ([\d.]+)–([\d.]+) mm across and ([\d.]+)–([\d.]+) mm down/)!
      .slice(1)
      .map(Number);
    [40, 50, 60, 70].forEach((want, i) => expect(Math.abs(where[i]! - want)).toBeLessThan(0.7));
    const bleed = checks(trimOnly.gagId, 'bleed');
    expect(bleed.map((c) => c.level)).toEqual(['fail', 'fail', 'fail', 'fail']);
    expect(bleed[0]!.message).toMatch(/stops 3\.0 mm short of the bleed edge on the left \(it stops at the trim\)/);
    expect(checks(band.gagId, 'cut-band')[0]).toMatchObject({ level: 'warn', message: expect.stringMatching(/^May be cut: .* on the bottom/) });
    expect(checks(line.gagId, 'cut-band')[0]!.level).toBe('ok');

    expect(book).toMatchObject({ pages: 7, binding: 'saddle', blanksToAdd: 1, level: 'fail' });
    expect(book.spineMm).toBeUndefined();
    expect((book.checks as Check[]).map((c) => c.rule)).toEqual(['page-count', 'missing']);

    // Asked again: nothing measured again, the same answer.
    const again = heavyTasksCompleted();
    const r2 = await callRoute(preflightRoute.GET, { as: 'editor', params: { volumeId: v.id } });
    expect(heavyTasksCompleted()).toBe(again);
    expect(r2.body).toEqual(r.body);
    expect(
      Number(
        (
          await db
            .selectFrom('finalPageAnalyses')
            .select((eb) => eb.fn.countAll().as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      ),
    ).toBeGreaterThanOrEqual(6);

    // A fit answers with the page's fresh preflight: the trim-sized scan refitted to the bleed covers it.
    const fit = await callRoute(fitRoute.PUT, {
      method: 'PUT',
      as: 'owner',
      params: { finalPageId: trimOnly.finalPageId },
      body: { to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 },
    });
    expect(fit.status).toBe(200);
    expect(fit.body.preflight).toMatchObject({ number: 6, gagId: trimOnly.gagId, finalPageId: trimOnly.finalPageId });
    expect((fit.body.preflight.checks as Check[]).filter((c) => c.rule === 'bleed')).toEqual([expect.objectContaining({ level: 'ok' })]);
    // 1772 px (150 mm at 300 ppi) now spread over 156 mm: 288.5 ppi, under greyscale's 300.
    expect(fit.body.preflight.ppi.x).toBeCloseTo(1772 / (156 / 25.4), 6);
    // With its figures, the caution the volume's answer carries: the printer's own specification takes precedence.
    expect(fit.body.preflight.note).toBe("The printer's own specification takes precedence.");
    expect(fit.body.preflight.note).toBe(note);

    // The page's own preflight reads the same, caution included, for any member.
    const one = await callRoute(pagePreflightRoute.GET, { as: 'viewer', params: { finalPageId: trimOnly.finalPageId } });
    expect(one.status).toBe(200);
    expect(one.body).toEqual(fit.body.preflight);
    expect(one.body.note).toBe(note);
    const soft1 = await callRoute(pagePreflightRoute.GET, { as: 'editor', params: { finalPageId: soft.finalPageId } });
    expect(soft1.body).toMatchObject({ number: 4, finalPageId: soft.finalPageId, level: 'warn', note });
  });
});

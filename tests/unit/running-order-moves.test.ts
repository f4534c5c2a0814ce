// Where a drop lands in the running order, and how it is said: the server request,
// the page number and the neighbours must agree (issue 15: "dropped at page 3, after
// Title page", never sounding like it replaces a page).
import { describe, expect, it } from 'vitest';
import { END_SLOT, landing, sayPlace, sayWhat } from '@/components/volume/running-order-moves';
import { entry } from '../support/entries';

const ORDER = [entry('c', 'cover'), entry('t', 'title'), entry('a', 'gag', 'Lunch'), entry('b', 'gag', 'Periscope'), entry('w', 'afterword')];

describe('a gag from the unplaced list', () => {
  it('goes in before the page it is over: its page number, the page before and after it, and the request', () => {
    const l = landing('gag:x', 'a', ORDER)!;
    expect(l.page).toBe(3);
    expect(l.after?.id).toBe('t');
    expect(l.before?.id).toBe('a');
    expect(l.request).toEqual({ before: 'a' });
    expect(sayPlace(l)).toBe('page 3, after Title page');
  });
  it('over the first page it becomes page 1, before the cover; over the end it is appended after the last page', () => {
    const first = landing('gag:x', 'c', ORDER)!;
    expect(sayPlace(first)).toBe('page 1, before Cover');
    expect(first.request).toEqual({ before: 'c' });
    const end = landing('gag:x', END_SLOT, ORDER)!;
    expect(end.request).toBe('append');
    expect(sayPlace(end)).toBe('page 6, after Afterword');
    expect(sayPlace(landing('gag:x', END_SLOT, [])!)).toBe('page 1');
  });
  it('over nothing, or an unknown id, lands nowhere', () => {
    expect(landing('gag:x', null, ORDER)).toBeNull();
    expect(landing('gag:x', 'nope', ORDER)).toBeNull();
  });
});

describe('a page of the running order', () => {
  it('moved down takes the place of the page it is over and sits after it', () => {
    const l = landing('t', 'b', ORDER)!;
    expect(l.page).toBe(4);
    expect(l.request).toEqual({ after: 'b' });
    expect(sayPlace(l)).toBe('page 4, after Periscope');
  });
  it('moved up sits before the page it is over', () => {
    const l = landing('w', 't', ORDER)!;
    expect(l.page).toBe(2);
    expect(l.request).toEqual({ before: 't' });
    expect(sayPlace(l)).toBe('page 2, after Cover');
  });
  it('over itself stays; over the end goes last', () => {
    expect(landing('a', 'a', ORDER)!.request).toBe('none');
    const end = landing('c', END_SLOT, ORDER)!;
    expect(end.page).toBe(5);
    expect(end.request).toEqual({ after: 'w' });
    expect(sayPlace(end)).toBe('page 5, after Afterword');
    expect(landing('w', END_SLOT, ORDER)!.request).toBe('none');
  });
});

describe('names in the announcements', () => {
  it('names a page by its number and label, a gag by its title', () => {
    expect(sayWhat('t', ORDER, [])).toBe('Page 2, Title page');
    expect(sayWhat('gag:x', ORDER, [{ id: 'x', title: 'Fog Horn' }])).toBe('The gag Fog Horn');
  });
});

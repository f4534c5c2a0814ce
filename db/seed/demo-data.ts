// The invented demo scenario from PRODUCT.md, as data: the series "Kettle Crab" (a
// hermit crab living in an old teapot on a pier, and a gull called Mrs Brine), its
// people, a dozen gags in every status with their beats, comments, and the volume
// "Low Tide"; and a second series for the outsider account.
import type { Role } from '@/lib/auth/permissions';
import type { BeatKind, GagStatus } from '@/lib/gags/status';

/** How many passes each demo status has drawn so far. */
export const PASSES_BY_STATUS: Record<GagStatus, number> = {
  idea: 0,
  thumbnailing: 1,
  in_review: 2,
  ready_to_ink: 3,
  inked: 2,
  scanned: 2,
  placed: 2,
};

export const DEMO_PASSWORD = 'kettle-crab-demo';
export const DEMO_SERIES_ID = 'demo-kettle-crab';
export const OTHER_SERIES_ID = 'demo-lantern-moth';

export const DEMO_USERS: { id: string; email: string; name: string }[] = [
  { id: 'demo-user-owner', email: 'owner@quadrille.test', name: 'Nell Harrow' },
  { id: 'demo-user-cocreator', email: 'cocreator@quadrille.test', name: 'Tam Quill' },
  { id: 'demo-user-editor', email: 'editor@quadrille.test', name: 'Ivo Sand' },
  { id: 'demo-user-viewer', email: 'viewer@quadrille.test', name: 'Bea Lark' },
  { id: 'demo-user-outsider', email: 'outsider@quadrille.test', name: 'Oskar Fenn' },
];

export const MEMBERSHIPS: { seriesId: string; userId: string; role: Role }[] = [
  { seriesId: DEMO_SERIES_ID, userId: 'demo-user-owner', role: 'owner' },
  { seriesId: DEMO_SERIES_ID, userId: 'demo-user-cocreator', role: 'cocreator' },
  { seriesId: DEMO_SERIES_ID, userId: 'demo-user-editor', role: 'editor' },
  { seriesId: DEMO_SERIES_ID, userId: 'demo-user-viewer', role: 'viewer' },
  { seriesId: OTHER_SERIES_ID, userId: 'demo-user-outsider', role: 'owner' },
];

export type DemoGag = {
  id: string;
  seriesId: string;
  title: string;
  premise: string;
  status: GagStatus;
  notes: Partial<Record<BeatKind, string>>;
};

export const DEMO_GAGS: DemoGag[] = [
  {
    id: 'demo-gag-01',
    seriesId: DEMO_SERIES_ID,
    status: 'placed',
    title: 'Low Tide Lunch',
    premise: 'Kettle reaches for a snack as the tide goes out, and the snack walks off on its own.',
    notes: {
      setup: 'Wide: pier at low tide, teapot on its side, Kettle peeking out.',
      build: 'Kettle stretches one claw toward a mussel on the sand.',
      turn: 'The mussel sprouts legs: it is another crab.',
      payoff: 'Kettle back in the pot, sipping from the spout, pretending nothing happened.',
    },
  },
  {
    id: 'demo-gag-02',
    seriesId: DEMO_SERIES_ID,
    status: 'placed',
    title: 'Spout Periscope',
    premise: 'Kettle spies on Mrs Brine through the teapot spout.',
    notes: {
      setup: 'Mrs Brine lands on a post with something shiny.',
      build: 'Only the spout turns to follow her, like a periscope.',
      turn: 'Mrs Brine peers straight down the spout.',
      payoff: 'Inside: one huge gull eye fills the dark. Kettle flat against the back wall.',
    },
  },
  {
    id: 'demo-gag-03',
    seriesId: DEMO_SERIES_ID,
    status: 'scanned',
    title: 'Lid Umbrella',
    premise: 'Kettle uses the lid as an umbrella; Mrs Brine wants to share it.',
    notes: {
      setup: 'First drops of rain on the pier boards.',
      build: 'Kettle strolls out holding the lid over his shell.',
      turn: 'Mrs Brine squeezes under the lid beside him.',
      payoff: 'Wide: the gull dry under the lid, Kettle outside it, soaked and flat.',
    },
  },
  {
    id: 'demo-gag-04',
    seriesId: DEMO_SERIES_ID,
    status: 'inked',
    title: 'Whistle Alarm',
    premise: 'The noon sun heats the teapot until it whistles and wakes the whole pier.',
    notes: {
      setup: 'Noon. Heat shimmer over the teapot.',
      build: 'Steam curls from the spout; Kettle asleep inside.',
      turn: 'The pot whistles; every gull on the pier leaps up.',
      payoff: 'A ring of angry gulls around the pot; Kettle offers them tea.',
    },
  },
  {
    id: 'demo-gag-05',
    seriesId: DEMO_SERIES_ID,
    status: 'ready_to_ink',
    title: 'Moving Day',
    premise: 'Kettle tries out a grand new shell and comes back to the teapot.',
    notes: {
      setup: 'A big spiral shell washes up, gleaming.',
      build: 'Kettle moves in, posing proudly.',
      turn: 'The shell is so heavy he cannot lift it.',
      payoff: 'Back in the teapot, patting it like an old friend.',
    },
  },
  {
    id: 'demo-gag-06',
    seriesId: DEMO_SERIES_ID,
    status: 'ready_to_ink',
    title: 'Finders Keepers',
    premise: 'Mrs Brine drops a fish; Kettle claims it; the fish is a bath toy.',
    notes: {
      setup: 'Mrs Brine flies over with a fish in her beak.',
      build: 'The fish falls; Kettle drags it home with effort.',
      turn: 'He bites: it squeaks.',
      payoff: 'Mrs Brine on the rail, laughing silently, wings over her face.',
    },
  },
  {
    id: 'demo-gag-07',
    seriesId: DEMO_SERIES_ID,
    status: 'in_review',
    title: 'Sugar Cube',
    premise: 'Kettle finds a sugar cube and saves it for later; the sea has other plans.',
    notes: {
      setup: 'A sugar cube on the pier, dropped by a passer-by (feet only).',
      build: 'Kettle carries it home above his head like a trophy.',
      turn: 'A wave splashes over the pier.',
      payoff: '',
    },
  },
  {
    id: 'demo-gag-08',
    seriesId: DEMO_SERIES_ID,
    status: 'in_review',
    title: 'Fog Horn',
    premise: 'In thick fog, Kettle mistakes the fog horn for Mrs Brine calling.',
    notes: {
      setup: 'Pier lost in fog; only the teapot outline.',
      build: 'A low blast; Kettle waves a claw toward the sound.',
      turn: 'The fog lifts: a huge ship horn.',
      payoff: 'Mrs Brine behind him, tapping his shell.',
    },
  },
  {
    id: 'demo-gag-09',
    seriesId: DEMO_SERIES_ID,
    status: 'thumbnailing',
    title: 'Tea Party',
    premise: 'Kettle sets a tiny tea party with barnacle cups; the gulls arrive uninvited.',
    notes: { setup: 'Barnacle cups laid out on a plank.', build: 'Kettle pours seawater from the spout.', turn: '' },
  },
  {
    id: 'demo-gag-10',
    seriesId: DEMO_SERIES_ID,
    status: 'thumbnailing',
    title: 'Handle Swing',
    premise: 'Kettle swings from the teapot handle like a trapeze artist.',
    notes: { setup: 'Kettle eyes the handle from below.' },
  },
  {
    id: 'demo-gag-11',
    seriesId: DEMO_SERIES_ID,
    status: 'idea',
    title: 'Sideways Race',
    premise: 'A race along the pier against a rival crab who only goes sideways faster.',
    notes: {},
  },
  {
    id: 'demo-gag-12',
    seriesId: DEMO_SERIES_ID,
    status: 'idea',
    title: 'Moon Steep',
    premise: 'The full-moon tide fills the teapot; Kettle steeps like a tea bag.',
    notes: {},
  },
  {
    id: 'demo-gag-21',
    seriesId: OTHER_SERIES_ID,
    status: 'thumbnailing',
    title: 'Porch Light',
    premise: 'A moth courts the porch light; the porch light switches off at dawn.',
    notes: { setup: 'Night porch, one bulb, one moth.' },
  },
  {
    id: 'demo-gag-22',
    seriesId: OTHER_SERIES_ID,
    status: 'idea',
    title: 'Candle Date',
    premise: 'The moth brings a candle to a date and regrets it.',
    notes: {},
  },
];

export type DemoComment = {
  id: string;
  gagId: string;
  pass?: number;
  panel?: number;
  beat?: BeatKind;
  by: string;
  body: string;
  parent?: string;
  resolved?: boolean;
};

export const DEMO_COMMENTS: DemoComment[] = [
  {
    id: 'demo-c-1',
    gagId: 'demo-gag-07',
    pass: 2,
    panel: 2,
    by: 'demo-user-editor',
    body: 'The wave arrives too late: the turn should hit in this panel, not the next.',
  },
  {
    id: 'demo-c-2',
    gagId: 'demo-gag-07',
    parent: 'demo-c-1',
    by: 'demo-user-cocreator',
    body: 'Agreed. I will raise the horizon and bring the wave in from the left.',
  },
  {
    id: 'demo-c-3',
    gagId: 'demo-gag-07',
    beat: 'payoff',
    by: 'demo-user-editor',
    body: 'The payoff has no note yet: what does Kettle hold at the end?',
  },
  { id: 'demo-c-4', gagId: 'demo-gag-08', pass: 2, panel: 3, by: 'demo-user-cocreator', body: 'Mrs Brine reads clearly here even as a silhouette.' },
  { id: 'demo-c-5', gagId: 'demo-gag-05', pass: 3, by: 'demo-user-editor', body: 'This pass reads in one glance. Stamped.', resolved: true },
];

/** Gags past "in review" carry the stamp that let them through, on their last pass. */
export const STAMPED: GagStatus[] = ['ready_to_ink', 'inked', 'scanned', 'placed'];

export const DEMO_VOLUME_ID = 'demo-volume-low-tide';
/** Volume 1 "Low Tide": front matter, the finished gags, an afterword. Nine pages: the flatplan asks for 3 blanks. */
export const LOW_TIDE_ORDER: { id: string; kind: 'gag' | 'cover' | 'title' | 'afterword'; gagId?: string }[] = [
  { id: 'demo-entry-cover', kind: 'cover' },
  { id: 'demo-entry-title', kind: 'title' },
  { id: 'demo-entry-01', kind: 'gag', gagId: 'demo-gag-01' },
  { id: 'demo-entry-02', kind: 'gag', gagId: 'demo-gag-02' },
  { id: 'demo-entry-03', kind: 'gag', gagId: 'demo-gag-03' },
  { id: 'demo-entry-04', kind: 'gag', gagId: 'demo-gag-04' },
  { id: 'demo-entry-05', kind: 'gag', gagId: 'demo-gag-05' },
  { id: 'demo-entry-06', kind: 'gag', gagId: 'demo-gag-06' },
  { id: 'demo-entry-afterword', kind: 'afterword' },
];

/** Loads the demo scenario; safe to run again (existing rows are left as they are). */

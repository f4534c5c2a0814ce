// What each demo gag shows, beat by beat: props placed in each of its four panels.
// Invented for the Kettle Crab scenario; drawn by demo-sketches.ts.

/** A prop, drawn at (u, v) in the panel (0–1 across and down), `k` times its usual size. */
export type Prop = [kind: PropKind, u: number, v: number, k?: number];
export type PropKind =
  | 'pier'
  | 'sea'
  | 'teapot'
  | 'teapot-side'
  | 'kettle'
  | 'kettle-reach'
  | 'kettle-flat'
  | 'kettle-cheer'
  | 'gull'
  | 'gull-flying'
  | 'crab'
  | 'mussel'
  | 'lid'
  | 'rain'
  | 'sun'
  | 'steam'
  | 'shell'
  | 'fish'
  | 'eye'
  | 'fog'
  | 'horn'
  | 'cube'
  | 'wave'
  | 'cups'
  | 'post'
  | 'bulb'
  | 'moth'
  | 'candle';

/** Four beats, each a list of props; the first two of each are what a first pass roughs in. */
export const SCENES: Record<string, Prop[][]> = {
  'demo-gag-01': [
    [
      ['pier', 0.5, 0.75],
      ['teapot-side', 0.4, 0.62],
      ['kettle', 0.33, 0.55, 0.7],
      ['sea', 0.5, 0.9],
    ],
    [
      ['pier', 0.5, 0.75],
      ['kettle-reach', 0.35, 0.62],
      ['mussel', 0.72, 0.7],
    ],
    [
      ['crab', 0.62, 0.62, 1.2],
      ['kettle', 0.25, 0.6, 0.8],
      ['pier', 0.5, 0.8],
    ],
    [
      ['teapot-side', 0.45, 0.6, 1.2],
      ['kettle', 0.38, 0.5, 0.6],
      ['crab', 0.85, 0.78, 0.5],
      ['pier', 0.5, 0.8],
    ],
  ],
  'demo-gag-02': [
    [
      ['post', 0.7, 0.6],
      ['gull', 0.7, 0.35],
      ['teapot', 0.3, 0.7],
      ['pier', 0.5, 0.82],
    ],
    [
      ['teapot', 0.35, 0.65, 1.2],
      ['gull', 0.75, 0.35, 0.8],
      ['pier', 0.5, 0.82],
    ],
    [
      ['gull', 0.5, 0.3, 1.4],
      ['teapot', 0.5, 0.78, 0.8],
    ],
    [
      ['eye', 0.5, 0.45, 2],
      ['kettle-flat', 0.5, 0.85, 0.7],
    ],
  ],
  'demo-gag-03': [
    [
      ['rain', 0.5, 0.3],
      ['pier', 0.5, 0.78],
      ['teapot', 0.3, 0.68, 0.8],
    ],
    [
      ['kettle', 0.5, 0.66],
      ['lid', 0.5, 0.5],
      ['rain', 0.5, 0.25],
      ['pier', 0.5, 0.8],
    ],
    [
      ['lid', 0.5, 0.4, 1.2],
      ['gull', 0.62, 0.55, 0.9],
      ['kettle', 0.4, 0.66, 0.8],
      ['rain', 0.5, 0.2],
    ],
    [
      ['lid', 0.45, 0.4],
      ['gull', 0.45, 0.55],
      ['kettle-flat', 0.8, 0.8],
      ['rain', 0.5, 0.25],
      ['pier', 0.5, 0.85],
    ],
  ],
  'demo-gag-04': [
    [
      ['sun', 0.75, 0.2],
      ['teapot', 0.45, 0.65],
      ['pier', 0.5, 0.8],
      ['steam', 0.6, 0.4, 0.6],
    ],
    [
      ['teapot', 0.5, 0.6, 1.3],
      ['steam', 0.72, 0.35],
      ['kettle', 0.47, 0.62, 0.5],
    ],
    [
      ['teapot', 0.5, 0.65],
      ['steam', 0.7, 0.3, 1.4],
      ['gull-flying', 0.25, 0.25],
      ['gull-flying', 0.8, 0.3, 0.8],
    ],
    [
      ['teapot', 0.5, 0.62],
      ['gull', 0.15, 0.6, 0.7],
      ['gull', 0.85, 0.6, 0.7],
      ['gull', 0.5, 0.3, 0.6],
      ['kettle-cheer', 0.5, 0.55, 0.6],
    ],
  ],
  'demo-gag-05': [
    [
      ['shell', 0.6, 0.65, 1.3],
      ['sea', 0.5, 0.85],
      ['pier', 0.5, 0.9],
    ],
    [
      ['shell', 0.5, 0.6, 1.4],
      ['kettle-cheer', 0.45, 0.45, 0.8],
      ['sea', 0.5, 0.88],
    ],
    [
      ['shell', 0.5, 0.65, 1.4],
      ['kettle-flat', 0.5, 0.85],
      ['pier', 0.5, 0.92],
    ],
    [
      ['teapot', 0.5, 0.6, 1.2],
      ['kettle', 0.35, 0.55, 0.7],
      ['pier', 0.5, 0.8],
    ],
  ],
  'demo-gag-06': [
    [
      ['gull-flying', 0.45, 0.3],
      ['fish', 0.52, 0.38, 0.7],
      ['pier', 0.5, 0.82],
    ],
    [
      ['fish', 0.55, 0.7],
      ['kettle-reach', 0.3, 0.7],
      ['teapot', 0.85, 0.68, 0.6],
      ['pier', 0.5, 0.82],
    ],
    [
      ['fish', 0.55, 0.55, 1.4],
      ['kettle', 0.3, 0.65],
    ],
    [
      ['post', 0.5, 0.65],
      ['gull', 0.5, 0.4, 1.1],
      ['pier', 0.5, 0.85],
    ],
  ],
  'demo-gag-07': [
    [
      ['cube', 0.5, 0.72],
      ['pier', 0.5, 0.8],
      ['post', 0.2, 0.55, 0.7],
    ],
    [
      ['kettle-cheer', 0.45, 0.66],
      ['cube', 0.45, 0.45, 0.8],
      ['pier', 0.5, 0.82],
    ],
    [
      ['wave', 0.45, 0.45, 1.3],
      ['kettle', 0.7, 0.75, 0.6],
      ['pier', 0.5, 0.85],
    ],
    [
      ['kettle-flat', 0.5, 0.75],
      ['pier', 0.5, 0.85],
      ['sea', 0.5, 0.92],
    ],
  ],
  'demo-gag-08': [
    [
      ['fog', 0.5, 0.5],
      ['teapot', 0.5, 0.66, 0.8],
      ['pier', 0.5, 0.8],
    ],
    [
      ['fog', 0.5, 0.45],
      ['kettle-cheer', 0.4, 0.62],
      ['pier', 0.5, 0.8],
    ],
    [
      ['horn', 0.65, 0.38, 1.3],
      ['kettle-flat', 0.25, 0.75],
      ['sea', 0.5, 0.85],
    ],
    [
      ['kettle', 0.4, 0.65],
      ['gull', 0.68, 0.5],
      ['pier', 0.5, 0.82],
    ],
  ],
  'demo-gag-09': [
    [
      ['cups', 0.5, 0.68],
      ['pier', 0.5, 0.78],
    ],
    [
      ['teapot', 0.35, 0.6],
      ['steam', 0.55, 0.5, 0.5],
      ['cups', 0.65, 0.7, 0.8],
      ['kettle', 0.3, 0.52, 0.6],
    ],
    [
      ['gull-flying', 0.3, 0.25],
      ['gull-flying', 0.7, 0.3],
      ['cups', 0.5, 0.72],
      ['pier', 0.5, 0.8],
    ],
    [
      ['gull', 0.3, 0.55],
      ['gull', 0.7, 0.55],
      ['kettle-flat', 0.5, 0.8, 0.7],
      ['cups', 0.5, 0.7, 0.6],
    ],
  ],
  'demo-gag-10': [
    [
      ['teapot', 0.5, 0.45, 1.2],
      ['kettle', 0.5, 0.8, 0.7],
      ['pier', 0.5, 0.88],
    ],
    [
      ['teapot', 0.5, 0.5],
      ['kettle-reach', 0.65, 0.4, 0.7],
    ],
    [
      ['kettle-cheer', 0.5, 0.35],
      ['teapot', 0.5, 0.7, 0.8],
    ],
    [
      ['kettle-flat', 0.5, 0.8],
      ['teapot', 0.5, 0.55],
    ],
  ],
  'demo-gag-21': [
    [
      ['bulb', 0.5, 0.3],
      ['moth', 0.65, 0.5],
    ],
    [
      ['bulb', 0.5, 0.3, 1.2],
      ['moth', 0.58, 0.42, 0.8],
    ],
    [
      ['bulb', 0.5, 0.3],
      ['sun', 0.15, 0.85, 0.8],
      ['moth', 0.55, 0.45],
    ],
    [
      ['moth', 0.5, 0.55, 1.2],
      ['sun', 0.8, 0.2],
    ],
  ],
};

/** A gag without a scene of its own (a new idea) gets a plain establishing shot. */
export const DEFAULT_SCENE: Prop[][] = [
  [
    ['pier', 0.5, 0.78],
    ['teapot', 0.45, 0.66],
  ],
  [
    ['pier', 0.5, 0.78],
    ['kettle', 0.5, 0.66],
  ],
  [
    ['gull', 0.5, 0.5],
    ['pier', 0.5, 0.8],
  ],
  [
    ['teapot', 0.5, 0.66],
    ['kettle', 0.4, 0.58, 0.6],
  ],
];
